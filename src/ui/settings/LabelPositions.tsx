// With direct labels (legend "on-plot"): how to move them, and a button that puts every dragged label back to
// its automatic place.
import { useAxband, type AxbandState } from "../store";
import { anyLabelMoved, resetLabelPositions } from "../figure/useLabelDrag";

const selectMoved = (s: AxbandState) => anyLabelMoved(s.project);

export function LabelPositions() {
  const moved = useAxband(selectMoved);
  return (
    <div className="setting label-positions">
      <p className="note">Drag a label on the figure to move it (or focus it and use the arrow keys).</p>
      <button type="button" data-testid="reset-label-positions" disabled={!moved} onClick={resetLabelPositions}>
        Reset label positions
      </button>
    </div>
  );
}
