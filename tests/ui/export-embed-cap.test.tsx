// Export menu with curve data too large to embed (over EMBED_MAX_CHARS, src/plot/figure-file.ts): the SVG is
// still exportFigureSvg's, and the user is told in an alert that the data were left out and to save the project file.
import { afterEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { ExportMenu } from "../../src/ui/export/ExportMenu";
import { useAxband } from "../../src/ui/store";
import { defaultProject, newCurve } from "../../src/data";
import { exportFigureSvg } from "../../src/plot/figure-file";
import { captureDownloads, useProject } from "./export-helpers";

afterEach(() => vi.restoreAllMocks());

describe("SVG export over the embedding cap", () => {
  test("downloads the figure and alerts that the curve data were left out", async () => {
    let s = 4242;
    const rnd = () => (s = (s * 48271) % 2147483647) / 2147483647;
    // 120,000 invented full-precision points: ~2.6 MB as an embedded project, over the 2 MB cap.
    const n = 120_000;
    const big = newCurve({ id: "big", label: "Big scan (invented)", massEv: Float64Array.from({ length: n }, (_, i) => 1e-6 * (1 + (9 * i) / n) * (1 + 1e-9 * rnd())), gInvGeV: Float64Array.from({ length: n }, () => 1e-13 * (1 + rnd())) });
    useProject({ ...defaultProject(), name: "Big export", curves: [big] });
    const downloads = captureDownloads();
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-svg"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    const project = useAxband.getState().project;
    expect(await downloads[0].text()).toBe(exportFigureSvg(project, { preset: project.figure.preset, embedProject: true }));
    const last = useAxband.getState().ui.messages.at(-1);
    expect(last?.kind).toBe("alert");
    expect(last?.text).toMatch(/^Saved Big export\.svg .* without the data of its curve \(120,000 points, more than 2 MB embedded\).*Save the project file/);
  });
});
