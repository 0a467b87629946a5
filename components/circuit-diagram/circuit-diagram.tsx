/**
 * The circuit drawn as SVG in Ketwise's own look: hairline wires, qubit 0 on top, gates
 * as rounded verdigris-outlined tiles with the name as written and the angles beneath,
 * controls as ink dots on a stem, X targets as ⊕, barriers as dashed fences. Pure
 * rendering of `layoutCircuit`; scrolls horizontally when wider than its container.
 */
import { cn } from "@/components/ui/cn";
import { layoutCircuit, rowY, type DiagramLayout, type DiagramOp, type PlacedOp } from "./layout";
import { plural } from "@/lib/format";

function Tile({
  x,
  y,
  w,
  h,
  label,
  param,
  dashed,
}: {
  x: number;
  y: number;
  w: number;
  h: number;
  label: string;
  param?: string;
  dashed?: boolean;
}) {
  return (
    <g>
      <rect
        x={x}
        y={y}
        width={w}
        height={h}
        rx={5}
        className={cn("fill-surface", dashed ? "stroke-ink-3" : "stroke-accent")}
        strokeWidth={1.25}
        strokeDasharray={dashed ? "3 2" : undefined}
      />
      <text
        x={x + w / 2}
        y={y + h / 2 + (param ? -2 : 4)}
        textAnchor="middle"
        className="fill-ink font-mono"
        fontSize={12}
        fontWeight={600}
      >
        {label}
      </text>
      {param ? (
        <text
          x={x + w / 2}
          y={y + h / 2 + 10}
          textAnchor="middle"
          className="fill-ink-2 font-mono"
          fontSize={9.5}
        >
          {param}
        </text>
      ) : null}
    </g>
  );
}

function XTarget({ cx, cy }: { cx: number; cy: number }) {
  return (
    <g className="stroke-ink" strokeWidth={1.3} fill="none">
      <circle cx={cx} cy={cy} r={9} className="fill-surface" />
      <line x1={cx - 9} x2={cx + 9} y1={cy} y2={cy} />
      <line x1={cx} x2={cx} y1={cy - 9} y2={cy + 9} />
    </g>
  );
}

function Cross({ cx, cy }: { cx: number; cy: number }) {
  return (
    <g className="stroke-ink" strokeWidth={1.6} strokeLinecap="round">
      <line x1={cx - 5} x2={cx + 5} y1={cy - 5} y2={cy + 5} />
      <line x1={cx - 5} x2={cx + 5} y1={cy + 5} y2={cy - 5} />
    </g>
  );
}

function Dot({ cx, cy }: { cx: number; cy: number }) {
  return <circle cx={cx} cy={cy} r={4} className="fill-ink" />;
}

function Item({ it, layout }: { it: PlacedOp; layout: DiagramLayout }) {
  const col = layout.columns[it.column];
  const cx = col.x + col.width / 2;
  const g = layout.geometry;
  const tileH = g.rowHeight - 14;
  const y = (q: number) => rowY(layout, q);
  const stem = (a: number, b: number) => (
    <line x1={cx} x2={cx} y1={y(a)} y2={y(b)} className="stroke-ink" strokeWidth={1.3} />
  );
  const role = it.role;

  if (role.kind === "barrier") {
    return (
      <line
        x1={cx}
        x2={cx}
        y1={y(it.top) - g.rowHeight / 2 + 4}
        y2={y(it.bottom) + g.rowHeight / 2 - 4}
        className="stroke-ink-3"
        strokeWidth={1.2}
        strokeDasharray="4 3"
      />
    );
  }
  if (role.kind === "measure" || role.kind === "reset") {
    return (
      <Tile
        x={cx - it.width / 2}
        y={y(it.top) - tileH / 2}
        w={it.width}
        h={tileH}
        label={it.label}
        dashed
      />
    );
  }
  if (role.kind === "swap") {
    return (
      <g>
        {stem(it.top, it.bottom)}
        {it.qubits.map((q) => (
          <Cross key={q} cx={cx} cy={y(q)} />
        ))}
      </g>
    );
  }
  if (role.kind === "controlled") {
    const controls = it.qubits.slice(0, role.controls);
    const targets = it.qubits.slice(role.controls);
    return (
      <g>
        {stem(it.top, it.bottom)}
        {controls.map((q) => (
          <Dot key={`c${q}`} cx={cx} cy={y(q)} />
        ))}
        {role.target === "x"
          ? targets.map((q) => <XTarget key={`t${q}`} cx={cx} cy={y(q)} />)
          : null}
        {role.target === "z" ? targets.map((q) => <Dot key={`t${q}`} cx={cx} cy={y(q)} />) : null}
        {role.target === "swap"
          ? targets.map((q) => <Cross key={`t${q}`} cx={cx} cy={y(q)} />)
          : null}
        {role.target === "box"
          ? targets.map((q) => (
              <Tile
                key={`t${q}`}
                x={cx - it.width / 2}
                y={y(q) - tileH / 2}
                w={it.width}
                h={tileH}
                label={it.label}
                param={it.paramLabel}
              />
            ))
          : null}
      </g>
    );
  }
  // A plain gate: one tile per qubit for single-qubit gates, one tall tile across the span otherwise.
  const top = y(it.top) - tileH / 2;
  const h = y(it.bottom) - y(it.top) + tileH;
  return (
    <g>
      <Tile
        x={cx - it.width / 2}
        y={top}
        w={it.width}
        h={h}
        label={it.label}
        param={it.paramLabel}
      />
      {it.qubits.length > 1
        ? it.qubits.map((q, k) => (
            <text
              key={q}
              x={cx - it.width / 2 + 4}
              y={y(q) + 3}
              className="fill-ink-3 font-mono"
              fontSize={8.5}
            >
              {k}
            </text>
          ))
        : null}
    </g>
  );
}

export function CircuitDiagram({
  qubits,
  ops,
  qubitLabels,
  omitted = 0,
  className,
  title,
}: {
  qubits: number;
  ops: readonly DiagramOp[];
  qubitLabels?: readonly string[];
  omitted?: number;
  className?: string;
  title?: string;
}) {
  const labels =
    qubitLabels?.length === qubits
      ? qubitLabels
      : Array.from({ length: qubits }, (_, i) => `q[${i}]`);
  const layout = layoutCircuit(qubits, ops, {
    labelChars: Math.max(...labels.map((l) => l.length), 4),
  });
  const more = omitted + layout.truncated;
  const wireEnd = layout.width - layout.geometry.gutter / 2;
  return (
    <figure className={cn("grid gap-1.5", className)}>
      <div className="overflow-x-auto rounded-md border border-line bg-surface-2/40">
        <svg
          width={layout.width}
          height={layout.height}
          viewBox={`0 0 ${layout.width} ${layout.height}`}
          role="img"
          aria-label={
            title ??
            `Circuit diagram: ${plural(qubits, "qubit")}, ${plural(ops.length + omitted, "operation")}, ${plural(layout.columns.length, "column")}.`
          }
          className="block"
        >
          {labels.map((label, q) => (
            <g key={q}>
              <text
                x={layout.geometry.labelWidth}
                y={rowY(layout, q) + 4}
                textAnchor="end"
                className="fill-ink-2 font-mono"
                fontSize={11.5}
              >
                {label}
              </text>
              <line
                x1={layout.geometry.labelWidth + 6}
                x2={wireEnd}
                y1={rowY(layout, q)}
                y2={rowY(layout, q)}
                className="stroke-line-strong"
                strokeWidth={1}
              />
            </g>
          ))}
          {layout.items.map((it) => (
            <Item key={it.index} it={it} layout={layout} />
          ))}
        </svg>
      </div>
      {more > 0 ? (
        <figcaption className="text-xs text-ink-3">
          Showing the first {layout.items.length} operations; {more} more are not drawn.
        </figcaption>
      ) : null}
    </figure>
  );
}
