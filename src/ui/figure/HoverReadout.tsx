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

const ROLE_WORD = { exclusion: "excluded by", projection: "within reach of", region: "inside" } as const;

export function HoverReadout() {
  const hover = useAxband(selectHover);
  const physics = useAxband(selectPhysics);
  const yView = useAxband(selectYView);
  const allCurves = useAxband(selectCurves);
  const preparing = useAxband(selectPreparing);
  // A curve still being prepared in the worker is not drawn yet: testing the point against it would prepare it
  // here, on the page, the long task the worker is there to avoid.
  const curves = useMemo(
    () => (preparing.length === 0 ? allCurves : allCurves.filter((c) => !isPreparing(preparing, c))),
    [allCurves, preparing],
  );
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
  const yName =
    yView === "normalized" ? (
      <>
        |E/N − c<sub>γ</sub>|
      </>
    ) : yView === "g-gamma" ? (
      <>
        |g<sub>γ</sub>|
      </>
    ) : null;
  const item = (label: ReactNode, value: string, testid?: string) => (
    <div className="readout-item" data-testid={testid}>
      <span>{label}</span>
      <span>{value}</span>
    </div>
  );
  return (
    <div className="readout" data-testid="hover-readout" aria-live="off">
      {item(
        <>
          m<sub>a</sub>
        </>,
        siFormat(hover.massEv, "eV"),
        "hover-mass",
      )}
      {yName ? item(yName, sciFormat(hover.y)) : null}
      {item(
        <>
          g<sub>aγγ</sub>
        </>,
        `${sciFormat(g)} GeV⁻¹`,
        "hover-g",
      )}
      {item(
        <>
          f<sub>a</sub>
        </>,
        `${sciFormat(faFromMass(hover.massEv, { constants }))} GeV`,
        "hover-fa",
      )}
      {item("frequency", siFormat(frequencyFromMass(hover.massEv), "Hz"), "hover-freq")}
      {item(
        "E/N of lines through it",
        `${minus(enLo.toPrecision(3))} or ${minus(enHi.toPrecision(3))}`,
        "hover-eovern",
      )}
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
