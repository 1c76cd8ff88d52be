// The curves list: the import buttons, then one card per imported curve (CurveCard).
import { useShallow } from "zustand/react/shallow";
import { ImportControls } from "../importer/ImportDialog";
import { selectCurveIds, useAxband } from "../store";
import { CurveCard } from "./CurveCard";
import "./curves.css";

/** The list of imported curves with their controls. */
export function CurvesPanel() {
  const ids = useAxband(useShallow(selectCurveIds));
  return (
    <section className="ax-panel ax-curves" aria-label="Curves">
      <ImportControls />
      {ids.length === 0 ? (
        <p className="ax-empty">No curves yet. Import a CSV file, drop one on the page, or paste data.</p>
      ) : (
        <ul className="ax-curve-list">
          {ids.map((id, i) => (
            <CurveCard key={id} id={id} index={i} count={ids.length} />
          ))}
        </ul>
      )}
    </section>
  );
}
