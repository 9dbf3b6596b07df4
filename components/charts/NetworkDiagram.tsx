// The network: treatments on a circle, node area by participants, edge width by number of studies.
import { Group } from "@visx/group";

export interface NetworkNode {
  id: string;
  label: string;
  participants: number | null;
}
export interface NetworkEdge {
  from: string;
  to: string;
  studies: number;
}

export function NetworkDiagram({ nodes, edges, title }: { nodes: NetworkNode[]; edges: NetworkEdge[]; title: string }) {
  // Labels run outwards along the radius, so neighbours need only a line's height between them
  // (about 18 px of circumference each): readable at 27 nodes and more. The figure leaves room for
  // the longest label in every direction.
  const wide = layout(nodes, (node) => node.label);
  // On a phone the names would shrink below reading size: each node carries its number, and the
  // names follow as a numbered list, whole, in the reader's direction.
  const narrow = layout(nodes, (_, i) => String(i + 1));
  return (
    <>
      <Drawing nodes={nodes} edges={edges} title={title} shape={wide} label={(node) => node.label} className="hidden w-full max-w-2xl font-sans sm:block" testId="network-diagram" />
      <div className="sm:hidden">
        <Drawing nodes={nodes} edges={edges} title={title} shape={narrow} label={(_, i) => String(i + 1)} upright className="w-full font-sans" testId="network-diagram-narrow" />
        <ol className="mt-2 grid grid-cols-1 gap-x-4 font-sans text-sm" data-testid="network-legend">
          {nodes.map((node, i) => (
            <li key={node.id}>
              <span className="inline-block w-7 font-semibold tabular-nums">{i + 1}</span>
              {node.label}
            </li>
          ))}
        </ol>
      </div>
    </>
  );
}

type Layout = ReturnType<typeof layout>;

/** Where each node sits on the circle, and the figure's size with room for the longest label. */
function layout(nodes: NetworkNode[], label: (node: NetworkNode, index: number) => string) {
  const radius = Math.max(140, (nodes.length * 18) / (2 * Math.PI));
  const labelSpace = 30 + 7 * Math.max(0, ...nodes.map((n, i) => label(n, i).length));
  const size = 2 * (radius + labelSpace);
  const position = new Map(
    nodes.map((node, i) => {
      const angle = (2 * Math.PI * i) / nodes.length - Math.PI / 2;
      return [node.id, { x: radius * Math.cos(angle), y: radius * Math.sin(angle), angle }] as const;
    }),
  );
  return { size, position };
}

/** `upright`: short labels (numbers) stand upright, centred beyond the node, instead of along the radius. */
function Drawing({ nodes, edges, title, shape, label, upright = false, className, testId }: { nodes: NetworkNode[]; edges: NetworkEdge[]; title: string; shape: Layout; label: (node: NetworkNode, index: number) => string; upright?: boolean; className: string; testId: string }) {
  const { size, position } = shape;
  const largest = Math.max(1, ...nodes.map((n) => n.participants ?? 0));
  const mostStudies = Math.max(1, ...edges.map((e) => e.studies));
  const nodeRadius = (n: NetworkNode) => (n.participants === null ? 8 : 5 + 14 * Math.sqrt(n.participants / largest));
  return (
    <svg viewBox={`0 0 ${size} ${size}`} direction="ltr" role="img" aria-label={title} className={className} data-testid={testId}>
      <title>{title}</title>
      <Group left={size / 2} top={size / 2}>
        {edges.map((edge) => {
          const a = position.get(edge.from)!;
          const b = position.get(edge.to)!;
          return <line key={`${edge.from}-${edge.to}`} x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke="#b9a9a0" strokeWidth={1 + 5 * (edge.studies / mostStudies)} />;
        })}
        {nodes.map((node, i) => {
          const p = position.get(node.id)!;
          const labelDistance = nodeRadius(node) + 6;
          return (
            <g key={node.id}>
              <circle cx={p.x} cy={p.y} r={nodeRadius(node)} fill="#6d1f35" />
              <text
                transform={
                  upright
                    ? `translate(${p.x + (labelDistance + 6) * Math.cos(p.angle)} ${p.y + (labelDistance + 6) * Math.sin(p.angle)})`
                    : `translate(${p.x + labelDistance * Math.cos(p.angle)} ${p.y + labelDistance * Math.sin(p.angle)}) rotate(${labelRotation(p.angle)})`
                }
                textAnchor={upright ? "middle" : Math.cos(p.angle) >= -1e-9 ? "start" : "end"}
                dy="0.35em"
                fontSize={13}
                fill="#1d1a17"
              >
                {label(node, i)}
              </text>
            </g>
          );
        })}
      </Group>
    </svg>
  );
}

/** Degrees that lay a label along its radius, turned over on the left half so that it never reads upside down. */
function labelRotation(angle: number): number {
  const degrees = (angle * 180) / Math.PI;
  return Math.cos(angle) >= -1e-9 ? degrees : degrees + 180;
}
