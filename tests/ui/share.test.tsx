// Project menu in jsdom: the share link field holds a fragment that decodes (with the data core's decoder)
// to the same project; a project whose curves make the link too long is shared without them and the user
// is told which were left out; project files save and open; a bad link in the address bar is refused.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { ProjectMenu } from "../../src/ui/share/ProjectMenu";
import { useAxband } from "../../src/ui/store";
import {
  decodeLink,
  defaultProject,
  encodeLink,
  LINK_MAX_CHARS,
  newCurve,
  projectFromFile,
  projectToFile,
} from "../../src/data";
import { captureDownloads, useProject } from "./export-helpers";

beforeEach(() => useProject(defaultProject()));
afterEach(() => {
  vi.restoreAllMocks();
  Object.defineProperty(navigator, "clipboard", { configurable: true, value: undefined });
});

function linkField(): HTMLInputElement {
  return screen.getByTestId("share-link-field") as HTMLInputElement;
}

describe("share link", () => {
  test("the field shows a link whose fragment decodes to the project; it is copied to the clipboard", async () => {
    const writeText = vi.fn(() => Promise.resolve());
    Object.defineProperty(navigator, "clipboard", { configurable: true, value: { writeText } });
    render(<ProjectMenu />);
    fireEvent.click(screen.getByTestId("share-link"));
    await waitFor(() => expect(writeText).toHaveBeenCalledTimes(1));
    const url = linkField().value;
    expect(writeText).toHaveBeenCalledWith(url);
    expect(linkField()).toHaveAttribute("readonly");
    const fragment = url.slice(url.indexOf("#") + 1);
    const r = decodeLink(fragment);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const project = useAxband.getState().project;
    // Equal projects encode to the same link (the codec is deterministic), curves included.
    expect(encodeLink(r.project)).toBe(encodeLink(project));
    expect(r.project.curves.map((c) => c.label)).toEqual(project.curves.map((c) => c.label));
    expect(useAxband.getState().ui.messages.at(-1)).toMatchObject({
      kind: "status",
      text: expect.stringMatching(/^Link copied/),
    });
  });

  test("without clipboard access the link is still shown, selected, and the message says so", async () => {
    render(<ProjectMenu />);
    fireEvent.click(screen.getByTestId("share-link"));
    await waitFor(() => expect(useAxband.getState().ui.messages.length).toBe(1));
    expect(linkField().value).toMatch(/#v3\./);
    expect(useAxband.getState().ui.messages[0].text).toMatch(/no clipboard access/);
  });

  test("a project too big for a link leaves its curves out and names them", async () => {
    const p = defaultProject();
    const n = 60_000;
    // Invented noisy data compresses badly, so the link with data would pass the limit by far.
    const massEv = new Float64Array(n).map((_, i) => 1e-6 * (1 + i / n));
    const gInvGeV = new Float64Array(n).map((_, i) => 1e-13 * (1 + Math.sin(i * 12.9898) * 0.5));
    const big = newCurve({ label: "Big demo scan (invented)", massEv, gInvGeV }, p);
    useProject({ ...p, curves: [...p.curves, big] });
    expect(encodeLink(useAxband.getState().project).length).toBeGreaterThan(LINK_MAX_CHARS);
    render(<ProjectMenu />);
    fireEvent.click(screen.getByTestId("share-link"));
    const omitted = await screen.findByTestId("share-omitted");
    expect(omitted.textContent).toContain("Big demo scan (invented)");
    const r = decodeLink(linkField().value.split("#")[1]);
    expect(r.ok && r.project.curves.length).toBe(0);
    expect(r.ok && r.project.models.map((m) => m.label)).toEqual(p.models.map((m) => m.label));
    expect(useAxband.getState().ui.messages.at(-1)?.text).toMatch(
      /leaves out .*Big demo scan \(invented\).*project file/,
    );
    expect(screen.getByRole("button", { name: "Save the project file instead" })).toBeInTheDocument();
  });
});

describe("project files", () => {
  test("Save project writes NAME.axband.json that reads back to the project", async () => {
    const downloads = captureDownloads();
    render(<ProjectMenu />);
    fireEvent.click(screen.getByTestId("project-menu"));
    fireEvent.click(screen.getByTestId("save-project"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(downloads[0].fileName).toMatch(/\.axband\.json$/);
    const text = await downloads[0].text();
    expect(text).toBe(projectToFile(useAxband.getState().project));
    const r = projectFromFile(text);
    expect(r.ok && r.project.curves.length).toBe(useAxband.getState().project.curves.length);
  });

  test("Open project replaces the project; a bad file shows an alert and changes nothing", async () => {
    const user = userEvent.setup({ delay: null });
    render(<ProjectMenu />);
    fireEvent.click(screen.getByTestId("project-menu"));
    const other = { ...defaultProject(), name: "Other project", curves: [] };
    await user.upload(
      screen.getByTestId("open-project"),
      new File([projectToFile(other)], "other.axband.json", { type: "application/json" }),
    );
    await waitFor(() => expect(useAxband.getState().project.name).toBe("Other project"));
    expect(useAxband.getState().ui.messages.at(-1)).toMatchObject({ kind: "status" });
    fireEvent.click(screen.getByTestId("project-menu"));
    const before = useAxband.getState().project;
    await user.upload(
      screen.getByTestId("open-project"),
      new File(["{ not json"], "broken.axband.json", { type: "application/json" }),
    );
    await waitFor(() => expect(useAxband.getState().ui.messages.at(-1)?.kind).toBe("alert"));
    expect(useAxband.getState().ui.messages.at(-1)?.text).toMatch(/broken\.axband\.json/);
    expect(useAxband.getState().project).toBe(before);
  });

  test("a tampered link typed into the address bar is refused and the project stays", async () => {
    render(<ProjectMenu />);
    const before = useAxband.getState().project;
    const good = encodeLink(before);
    window.location.hash = `${good.slice(0, 40)}AAAA`;
    await waitFor(() => expect(useAxband.getState().ui.messages.at(-1)?.kind).toBe("alert"));
    expect(useAxband.getState().ui.messages.at(-1)?.text).toMatch(
      /^This link is damaged \(.*\. Your project is unchanged\.$/,
    );
    expect(useAxband.getState().project).toBe(before);
  });
});
