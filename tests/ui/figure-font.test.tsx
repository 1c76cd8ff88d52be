// The Font setting of the Figure section driven like a user: a labelled select (test id figure-font) offering
// Computer Modern Sans and Serif; choosing Serif goes through the store with undo, and the figure's scene then
// names CMU Serif first.
import { beforeEach, describe, expect, test } from "vitest";
import { render, screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { FigureSettings } from "../../src/ui/settings/FigureSettings";
import { useAxband } from "../../src/ui/store";
import { buildScene } from "../../src/plot/scene";
import { resetStore } from "./helpers";

beforeEach(() => resetStore());

describe("Font setting", () => {
  test("offers sans and serif, sans first; choosing serif is one undo step", async () => {
    const user = userEvent.setup({ delay: null });
    render(<FigureSettings />);
    const select = screen.getByTestId("figure-font");
    expect(screen.getByLabelText("Font")).toBe(select);
    const options = within(select).getAllByRole("option") as HTMLOptionElement[];
    expect(options.map((o) => o.value)).toEqual(["sans", "serif"]);
    expect((select as HTMLSelectElement).value).toBe("sans");
    await user.selectOptions(select, "serif");
    expect(useAxband.getState().project.figure.font).toBe("serif");
    expect(buildScene(useAxband.getState().project).fontFamily).toMatch(/^'CMU Serif'/);
    useAxband.getState().undo();
    expect(useAxband.getState().project.figure.font).toBe("sans");
  });
});
