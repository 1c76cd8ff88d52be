// Renders a Scene as React SVG elements, node for node and attribute for attribute as writeSvg writes it
// (same text placement through placeRuns, same colour sanitising), so the screen matches the export.
import { memo, useMemo, type ReactNode, type SVGProps } from "react";
import type { PathNode, RectNode, Scene, SceneLayer, SceneNode, TextNode } from "../../plot/scene-types";
import { placeRuns } from "../../plot/text";
import { safeColour } from "../../plot/format";

// The same guards as the SVG writer: data keys, ids, path data and dash arrays it accepts.
const DATA_KEY = /^[a-z0-9-]+$/;
const ID_SAFE = /[^A-Za-z0-9_-]/g;
const PATH_SAFE = /^[MLHVZCQSTAmlhvzcqsta0-9eE+\-.,\s]*$/;
const DASH_SAFE = /^[0-9.\s,]*$/;

function r2(v: number): number {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) || !Number.isFinite(r) ? 0 : r;
}

/** Optional number rounded like the writer's attributes. */
function num(v: number | undefined): number | undefined {
  return v === undefined ? undefined : r2(v);
}

function paint(value: string | undefined): string | undefined {
  if (value === undefined) return undefined;
  return value === "none" ? "none" : safeColour(value, "#000000");
}

/** data-* props of a node or layer (keys without the prefix in the scene). */
function dataProps(data: Record<string, string> | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  if (!data) return out;
  for (const key of Object.keys(data)) if (DATA_KEY.test(key)) out[`data-${key}`] = String(data[key]);
  return out;
}

/** Element ids in document order as the writer gives them: prefix + safe id, repeats get "-2", "-3"… */
function assignIds(scene: Scene, prefix: string): { clip: string; layers: (string | undefined)[]; nodes: (string | undefined)[][] } {
  const used = new Map<string, number>();
  const get = (id: string | undefined) => {
    if (!id) return undefined;
    const base = prefix + id.replace(ID_SAFE, "_");
    const n = used.get(base) ?? 0;
    used.set(base, n + 1);
    return n === 0 ? base : `${base}-${n + 1}`;
  };
  const clip = get("plot-clip") as string;
  const layers: (string | undefined)[] = [];
  const nodes: (string | undefined)[][] = [];
  for (const layer of scene.layers) {
    layers.push(get(layer.id));
    nodes.push(layer.nodes.map((n) => get(n.id)));
  }
  return { clip, layers, nodes };
}

function PathEl({ n, id }: { n: PathNode; id: string | undefined }) {
  const stroke = paint(n.stroke);
  const props: SVGProps<SVGPathElement> = {
    id,
    d: PATH_SAFE.test(n.d) ? n.d : "",
    fill: paint(n.fill) ?? "none",
    fillOpacity: num(n.fillOpacity),
  };
  if (n.stroke) {
    props.stroke = stroke;
    props.strokeWidth = num(n.strokeWidth);
    props.strokeOpacity = num(n.strokeOpacity);
    if (n.dash && DASH_SAFE.test(n.dash)) props.strokeDasharray = n.dash;
    props.strokeLinejoin = "round";
  }
  return <path {...props} {...dataProps(n.data)} />;
}

function RectEl({ n, id }: { n: RectNode; id: string | undefined }) {
  return (
    <rect
      id={id}
      x={r2(n.x)}
      y={r2(n.y)}
      width={r2(Math.max(0, n.w))}
      height={r2(Math.max(0, n.h))}
      fill={paint(n.fill) ?? "none"}
      fillOpacity={num(n.fillOpacity)}
      stroke={paint(n.stroke)}
      strokeWidth={n.stroke ? num(n.strokeWidth) : undefined}
      {...dataProps(n.data)}
    />
  );
}

function TextEl({ n, id }: { n: TextNode; id: string | undefined }) {
  const placed = placeRuns(n);
  return (
    <text
      id={id}
      x={r2(n.x)}
      y={r2(placed.baselineY)}
      fontSize={num(n.sizePx)}
      textAnchor={n.anchor === "start" ? undefined : n.anchor}
      fontWeight={n.weight === "bold" ? "bold" : undefined}
      fill={paint(n.fill) ?? "#000000"}
      transform={n.rotate ? `rotate(${r2(n.rotate)} ${r2(n.x)} ${r2(n.y)})` : undefined}
      xmlSpace="preserve"
      {...dataProps(n.data)}
    >
      {placed.runs.map((r, i) =>
        r.dyPx !== 0 || r.sizePx !== undefined || r.italic ? (
          <tspan key={i} dy={r.dyPx !== 0 ? r2(r.dyPx) : undefined} fontSize={num(r.sizePx)} fontStyle={r.italic ? "italic" : undefined}>
            {r.text}
          </tspan>
        ) : (
          r.text
        ),
      )}
    </text>
  );
}

function NodeEl({ n, id }: { n: SceneNode; id: string | undefined }) {
  if (n.kind === "path") return <PathEl n={n} id={id} />;
  if (n.kind === "rect") return <RectEl n={n} id={id} />;
  return <TextEl n={n} id={id} />;
}

/** One layer group; memoised on the layer object so unchanged layers are not diffed again. */
const Layer = memo(function Layer({ layer, id, nodeIds, clipId }: { layer: SceneLayer; id: string | undefined; nodeIds: (string | undefined)[]; clipId: string }) {
  return (
    <g id={id} clipPath={layer.clip ? `url(#${clipId})` : undefined} {...dataProps(layer.data)}>
      {layer.nodes.map((n, i) => (
        <NodeEl key={nodeIds[i] ?? i} n={n} id={nodeIds[i]} />
      ))}
    </g>
  );
});

export interface SceneSvgProps extends Omit<SVGProps<SVGSVGElement>, "viewBox"> {
  /** Screen-only overlays drawn above the scene (never part of the export). */
  children?: ReactNode;
  scene: Scene;
  /** Prefix of every id (several figures on one page must not share ids). */
  idPrefix: string;
}

/** The scene as an <svg> with a viewBox in scene px; CSS decides the displayed size. */
export function SceneSvg({ scene, idPrefix, children, ...rest }: SceneSvgProps) {
  const ids = useMemo(() => assignIds(scene, idPrefix.replace(ID_SAFE, "_")), [scene, idPrefix]);
  const clipId = ids.clip;
  const { plot } = scene;
  return (
    <svg
      xmlns="http://www.w3.org/2000/svg"
      viewBox={`0 0 ${r2(scene.widthPx)} ${r2(scene.heightPx)}`}
      fontFamily={scene.fontFamily}
      strokeLinecap="butt"
      {...rest}
    >
      <defs>
        <clipPath id={clipId}>
          <rect x={r2(plot.x)} y={r2(plot.y)} width={r2(plot.w)} height={r2(plot.h)} />
        </clipPath>
      </defs>
      {scene.layers.map((layer, i) => (
        <Layer key={layer.id} layer={layer} id={ids.layers[i]} nodeIds={ids.nodes[i]} clipId={clipId} />
      ))}
      {children}
    </svg>
  );
}
