// Test helpers for component tests: a clean app store with a known project before each test.
import { PROJECT_VERSION, type Project } from "../../src/project/types";
import { useAxband } from "../../src/ui/store";

/** A project with no models or curves and the 2019 constants (c_γ = 1.92, K = 5.691 μeV). */
export function blankProject(): Project {
  const base = useAxband.getState().project;
  return {
    version: PROJECT_VERSION,
    name: "Test",
    physics: {
      ref: "2019",
      custom: { cGamma: 1.92, cGammaSigma: 0.04, kMuEv: 5.691, kMuEvSigma: 0.051, label: "custom" },
    },
    models: [],
    curves: [],
    figure: { ...base.figure, yView: "coupling" },
  };
}

/** Resets the app store to {@link blankProject} (or the given project) with empty history and no messages. */
export function resetStore(project: Project = blankProject()): void {
  const s = useAxband.getState();
  s.resetProject(project);
  useAxband.setState({ ui: { messages: [], tabConflict: null, highlight: null, hover: null } });
}
