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
  const radius = Math.max(140, (nodes.length * 18) / (2 * Math.PI));
  const labelSpace = 30 + 7 * Math.max(0, ...nodes.map((n) => n.label.length));
  const width = 2 * (radius + labelSpace);
  const height = width;
  const position = new Map(
    nodes.map((node, i) => {
      const angle = (2 * Math.PI * i) / nodes.length - Math.PI / 2;
      return [node.id, { x: radius * Math.cos(angle), y: radius * Math.sin(angle), angle }] as const;
    }),
  );
  const largest = Math.max(1, ...nodes.map((n) => n.participants ?? 0));
  const mostStudies = Math.max(1, ...edges.map((e) => e.studies));
  const nodeRadius = (n: NetworkNode) => (n.participants === null ? 8 : 5 + 14 * Math.sqrt(n.participants / largest));
  return (
    <svg viewBox={`0 0 ${width} ${height}`} direction="ltr" role="img" aria-label={title} className="w-full min-w-[32rem] max-w-2xl font-sans" data-testid="network-diagram">
      <title>{title}</title>
      <Group left={width / 2} top={height / 2}>
        {edges.map((edge) => {
          const a = position.get(edge.from)!;
          const b = position.get(edge.to)!;
          return <line key={`${edge.from}-${edge.to}`} x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke="#b9a9a0" strokeWidth={1 + 5 * (edge.studies / mostStudies)} />;
        })}
        {nodes.map((node) => {
          const p = position.get(node.id)!;
          const labelDistance = nodeRadius(node) + 6;
          return (
            <g key={node.id}>
              <circle cx={p.x} cy={p.y} r={nodeRadius(node)} fill="#6d1f35" />
              <text
                transform={`translate(${p.x + labelDistance * Math.cos(p.angle)} ${p.y + labelDistance * Math.sin(p.angle)}) rotate(${labelRotation(p.angle)})`}
                textAnchor={Math.cos(p.angle) >= -1e-9 ? "start" : "end"}
                dy="0.35em"
                fontSize={13}
                fill="#1d1a17"
              >
                {node.label}
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
