// The Legend setting of the Figure section driven like a user: "best corner (automatic)" (auto) is offered first, is
// what a new project shows, and choosing a place goes through the store with undo.
import { beforeEach, describe, expect, test } from "vitest";
import { render, screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { defaultProject } from "../../src/project/demo";
import { FigureSettings } from "../../src/ui/settings/FigureSettings";
import { FigureView } from "../../src/ui/figure/FigureView";
import { useAxband } from "../../src/ui/store";
import { blankProject, resetStore } from "./helpers";

beforeEach(() => resetStore());

const legend = () => useAxband.getState().project.figure.legend;

describe("Legend setting", () => {
  test('offers "best corner (automatic)" (auto) first, then the fixed corners, outside right, below, above, on the plot and hidden', () => {
    render(<FigureSettings />);
    const select = screen.getByLabelText("Legend");
    const options = within(select).getAllByRole("option") as HTMLOptionElement[];
    expect(options.map((o) => o.value)).toEqual([
      "auto",
      "top-left",
      "top-right",
      "bottom-left",
      "bottom-right",
      "outside-right",
      "below",
      "above",
      "on-plot",
      "hidden",
    ]);
    expect(options[0]).toHaveTextContent("best corner (automatic)");
    expect(screen.getByTestId("legend-place")).toBe(select);
  });

  test('a new project shows "best corner (automatic)"', () => {
    resetStore(defaultProject());
    render(<FigureSettings />);
    expect(screen.getByLabelText("Legend")).toHaveValue("auto");
    expect((screen.getByRole("option", { name: "best corner (automatic)" }) as HTMLOptionElement).selected).toBe(true);
  });

  test("choosing a fixed corner and back to best corner updates the figure; undo restores the previous place", async () => {
    const user = userEvent.setup({ delay: null });
    resetStore({ ...blankProject(), figure: { ...blankProject().figure, legend: "auto" } });
    render(<FigureSettings />);
    const select = screen.getByLabelText("Legend");
    await user.selectOptions(select, "bottom-left");
    expect(legend()).toBe("bottom-left");
    await user.selectOptions(select, "best corner (automatic)");
    expect(legend()).toBe("auto");
    expect(select).toHaveValue("auto");
    useAxband.getState().undo();
    expect(legend()).toBe("bottom-left");
  });

  test("the legend text size goes through the store with undo; a new project has the default size", async () => {
    const user = userEvent.setup({ delay: null });
    resetStore(defaultProject());
    render(<FigureSettings />);
    const field = screen.getByTestId("legend-scale");
    expect(field).toHaveValue(1);
    await user.clear(field);
    await user.type(field, "0.85");
    expect(useAxband.getState().project.figure.legendScale).toBe(0.85);
    // Out of range (0.7–1.5): not applied.
    await user.clear(field);
    await user.type(field, "3");
    expect(useAxband.getState().project.figure.legendScale).toBe(0.85);
    // The typed steps count as one change.
    useAxband.getState().undo();
    expect(useAxband.getState().project.figure.legendScale).toBe(1);
  });

  test("a legend entry that must be shortened is named in a note under the figure; a place with room clears it", async () => {
    const user = userEvent.setup({ delay: null });
    const p = defaultProject();
    // One word wider than any legend room on a single column cannot wrap: it is cut, and the note says which.
    const word = "Averyveryverylongsinglewordlabelthatcannotwrapanywhereatall";
    p.models[0] = { ...p.models[0], label: word };
    resetStore({ ...p, figure: { ...p.figure, preset: "single-column", legend: "outside-right" } });
    render(
      <>
        <FigureView />
        <FigureSettings />
      </>,
    );
    expect(await screen.findByTestId("legend-note")).toHaveTextContent(word);
    // On a slide the box below the plot is wide enough for the word: no note.
    await user.selectOptions(screen.getByLabelText("Size"), "slide");
    await user.selectOptions(screen.getByTestId("legend-place"), "below");
    await expect.poll(() => screen.queryByTestId("legend-note")).toBeNull();
  });
});
