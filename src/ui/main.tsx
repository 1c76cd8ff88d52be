// Browser entry point: restores the project (link, autosave or demo), starts autosave, mounts the app.
import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { App } from "./App";
import { useAxband } from "./store";
import { initProject, startAutosave } from "./store/autosave";
// One cascade in the order of the former single sheet: the base, then the panels' own sheets.
import "./styles.css";
import "./models/models.css";
import "./models/calculator.css";
import "./settings/settings.css";
import "./figure/figure.css";
import "./layout/messages.css";

async function start() {
  // Restore before saving starts, so the demo project never overwrites a saved one.
  try {
    await initProject(useAxband);
  } catch (e) {
    // The app must open even when restoring fails in an unforeseen way; the demo project is already loaded.
    useAxband
      .getState()
      .pushMessage("alert", `The saved project could not be restored (${e instanceof Error ? e.message : String(e)}).`);
  }
  startAutosave(useAxband);
  createRoot(document.getElementById("root")!).render(
    <StrictMode>
      <App />
    </StrictMode>,
  );
}

void start();
