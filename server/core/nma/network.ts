// The network's shape: its treatments, and whether it is connected (METHODS.md §1: edges join
// treatments that share a study). A disconnected network names its sub-networks.
import { DatasetError, type ArmEffects } from "./types";

export function treatmentsOf(studies: ArmEffects[]): string[] {
  return [...new Set(studies.flatMap((s) => s.treatments))].sort();
}

/** The connected sub-networks, each sorted, largest first. */
export function subNetworks(studies: ArmEffects[]): string[][] {
  const parent = new Map<string, string>();
  const find = (t: string): string => {
    let root = t;
    while (parent.get(root) !== root) root = parent.get(root)!;
    parent.set(t, root);
    return root;
  };
  for (const t of treatmentsOf(studies)) parent.set(t, t);
  for (const study of studies) {
    for (const t of study.treatments.slice(1)) parent.set(find(t), find(study.treatments[0]!));
  }
  const groups = new Map<string, string[]>();
  for (const t of parent.keys()) groups.set(find(t), [...(groups.get(find(t)) ?? []), t]);
  return [...groups.values()].map((g) => g.sort()).sort((a, b) => b.length - a.length || a[0]!.localeCompare(b[0]!));
}

export function assertConnected(studies: ArmEffects[]): void {
  const parts = subNetworks(studies);
  if (parts.length > 1) {
    throw new DatasetError([
      {
        rule: "disconnected-network",
        facts: { parts: parts.map((p) => `{${p.join(", ")}}`).join(" · ") },
        message: `the network is not connected; its sub-networks are ${parts.map((p) => `{${p.join(", ")}}`).join(" and ")}`,
      },
    ]);
  }
}
