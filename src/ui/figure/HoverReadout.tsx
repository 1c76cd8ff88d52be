// The hover readout under the figure: m_a, the y-view value and g_aγγ, f_a, frequency, the two E/N values
// whose model lines pass through the point, and the visible curves that exclude, reach or contain it.
import { useMemo, type ReactNode } from "react";
import { eOverNAt, faFromMass, frequencyFromMass } from "../../physics/coupling";
import { constantsOf } from "../../plot/physics-settings";
import { viewToG } from "../../plot/scales";
import { selectCurves, selectHover, selectPhysics, selectPreparing, selectYView, useAxband } from "../store";
import { isPreparing } from "../store/preparation";
import { minus, sciFormat, siFormat } from "../format";
import { curvesAtPoint } from "./hit";
import type { YView } from "../../project/types";

const ROLE_WORD = { exclusion: "excluded by", projection: "within reach of", region: "inside" } as const;

/** The visible curves the readout tests the point against: those drawn already. */
function useDrawnCurves() {
  const allCurves = useAxband(selectCurves);
  const preparing = useAxband(selectPreparing);
  // A curve still being prepared in the worker is not drawn yet: testing the point against it would prepare it
  // here, on the page, the long task the worker is there to avoid.
  return useMemo(
    () => (preparing.length === 0 ? allCurves : allCurves.filter((c) => !isPreparing(preparing, c))),
    [allCurves, preparing],
  );
}

function ReadoutItem({ label, value, testid }: { label: ReactNode; value: string; testid?: string }) {
  return (
    <div className="readout-item" data-testid={testid}>
      <span>{label}</span>
      <span>{value}</span>
    </div>
  );
}

/** The name of the y value when the y view is not g_aγγ itself. */
function yViewName(yView: YView): ReactNode {
  if (yView === "normalized")
    return (
      <>
        |E/N − c<sub>γ</sub>|
      </>
    );
  if (yView === "g-gamma")
    return (
      <>
        |g<sub>γ</sub>|
      </>
    );
  return null;
}

export function HoverReadout() {
  const hover = useAxband(selectHover);
  const physics = useAxband(selectPhysics);
  const yView = useAxband(selectYView);
  const curves = useDrawnCurves();
  const constants = useMemo(() => constantsOf(physics), [physics]);

  if (!hover) {
    return (
      <div className="readout" data-testid="hover-readout" aria-live="off">
        <span className="readout-empty">
          Point at the figure to read off m_a, g_aγγ, f_a, the frequency and the E/N values there.
        </span>
      </div>
    );
  }
  const g = viewToG(yView, hover.massEv, hover.y, constants);
  const [enLo, enHi] = eOverNAt(hover.massEv, g, { constants });
  const hits = curvesAtPoint(curves, hover.massEv, g);
  const yName = yViewName(yView);
  return (
    <div className="readout" data-testid="hover-readout" aria-live="off">
      <ReadoutItem
        label={
          <>
            m<sub>a</sub>
          </>
        }
        value={siFormat(hover.massEv, "eV")}
        testid="hover-mass"
      />
      {yName ? <ReadoutItem label={yName} value={sciFormat(hover.y)} /> : null}
      <ReadoutItem
        label={
          <>
            g<sub>aγγ</sub>
          </>
        }
        value={`${sciFormat(g)} GeV⁻¹`}
        testid="hover-g"
      />
      <ReadoutItem
        label={
          <>
            f<sub>a</sub>
          </>
        }
        value={`${sciFormat(faFromMass(hover.massEv, { constants }))} GeV`}
        testid="hover-fa"
      />
      <ReadoutItem label="frequency" value={siFormat(frequencyFromMass(hover.massEv), "Hz")} testid="hover-freq" />
      <ReadoutItem
        label="E/N of lines through it"
        value={`${minus(enLo.toPrecision(3))} or ${minus(enHi.toPrecision(3))}`}
        testid="hover-eovern"
      />
      <div className="readout-item readout-wide" data-testid="hover-curves">
        <span>curves</span>
        <span>
          {hits.length === 0
            ? "not excluded, reached or contained by any visible curve"
            : hits.map((h) => `${ROLE_WORD[h.role]} ${h.label}`).join("; ")}
        </span>
      </div>
    </div>
  );
}
