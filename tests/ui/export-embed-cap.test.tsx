// Export menu with curve data too large to embed (over EMBED_MAX_CHARS or EMBED_MAX_POINTS, src/formats/figure-file.ts): the SVG is
// still exportFigureSvg's, and the user is told in an alert that the data were left out and to save the project file.
import { afterEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { ExportMenu } from "../../src/ui/export/ExportMenu";
import { useAxband } from "../../src/ui/store";
import { defaultProject, newCurve } from "../../src/data";
import { exportFigureSvg } from "../../src/formats/figure-file";
import { captureDownloads, useProject } from "./export-helpers";

afterEach(() => vi.restoreAllMocks());

describe("SVG export over the embedding cap", () => {
  test("downloads the figure and alerts that the curve data were left out", async () => {
    let s = 4242;
    const rnd = () => (s = (s * 48271) % 2147483647) / 2147483647;
    // 120,000 invented full-precision points: ~2.6 MB as an embedded project, over the 2 MB cap.
    const n = 120_000;
    const big = newCurve({
      id: "big",
      label: "Big scan (invented)",
      massEv: Float64Array.from({ length: n }, (_, i) => 1e-6 * (1 + (9 * i) / n) * (1 + 1e-9 * rnd())),
      gInvGeV: Float64Array.from({ length: n }, () => 1e-13 * (1 + rnd())),
    });
    useProject({ ...defaultProject(), name: "Big export", curves: [big] });
    const downloads = captureDownloads();
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-svg"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    const project = useAxband.getState().project;
    expect(await downloads[0].text()).toBe(
      exportFigureSvg(project, { preset: project.figure.preset, embedProject: true }),
    );
    const last = useAxband.getState().ui.messages.at(-1);
    expect(last?.kind).toBe("alert");
    expect(last?.text).toMatch(
      /^Saved Big export\.svg .* without the data of its curve \(120,000 points, over the 2 MB cap for embedded data\).*Save the project file/,
    );
  });

  test("names the point cap when the curves have more points than a figure file carries", async () => {
    // 500,001 invented points on a round grid: tiny when packed, but over the 500,000-point cap.
    const n = 500_001;
    const grid = newCurve({
      id: "grid",
      label: "Grid scan (invented)",
      massEv: Float64Array.from({ length: n }, (_, i) => (i + 1) * 1e-9),
      gInvGeV: new Float64Array(n).fill(1e-13),
    });
    useProject({ ...defaultProject(), name: "Grid export", curves: [grid] });
    const downloads = captureDownloads();
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-svg"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(await downloads[0].text()).toContain('curves="omitted"');
    const last = useAxband.getState().ui.messages.at(-1);
    expect(last?.kind).toBe("alert");
    expect(last?.text).toMatch(
      /without the data of its curve \(500,001 points, over the cap of 500,000 points for embedded data\)/,
    );
  });
});
