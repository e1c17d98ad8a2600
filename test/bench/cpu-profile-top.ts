/**
 * Reads a V8 .cpuprofile (node --cpu-prof) and lists the functions with the most self time and
 * the most total (inclusive) time, as percentages of the sampled time.
 */
import { readFileSync } from 'node:fs';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}

interface CpuProfile {
  nodes: ProfileNode[];
  samples: number[];
  timeDeltas: number[];
}

export interface FunctionTime {
  name: string;
  selfPct: number;
  totalPct: number;
}

function label(n: ProfileNode): string {
  const file = n.callFrame.url.split('/').pop() ?? '';
  return `${n.callFrame.functionName || '(anonymous)'} ${file}:${n.callFrame.lineNumber + 1}`;
}

export function topFunctions(path: string, count: number): { self: FunctionTime[]; total: FunctionTime[]; sampledS: number } {
  const p = JSON.parse(readFileSync(path, 'utf8')) as CpuProfile;
  const byId = new Map<number, ProfileNode>();
  for (const node of p.nodes) byId.set(node.id, node);
  const parent = new Map<number, number>();
  for (const node of p.nodes) for (const c of node.children ?? []) parent.set(c, node.id);
  const selfUs = new Map<string, number>();
  const totalUs = new Map<string, number>();
  let all = 0;
  for (let i = 0; i < p.samples.length; i++) {
    const dt = p.timeDeltas[i] ?? 0;
    const leaf = byId.get(p.samples[i] as number);
    if (!leaf) continue;
    all += dt;
    const own = label(leaf);
    selfUs.set(own, (selfUs.get(own) ?? 0) + dt);
    // each function once per sample, however often it recurses
    const seen = new Set<string>();
    for (let id: number | undefined = leaf.id; id !== undefined; id = parent.get(id)) {
      const node = byId.get(id);
      if (!node) break;
      const name = label(node);
      if (seen.has(name)) continue;
      seen.add(name);
      totalUs.set(name, (totalUs.get(name) ?? 0) + dt);
    }
  }
  const rank = (m: Map<string, number>): FunctionTime[] =>
    [...m.entries()]
      .sort((a, b) => b[1] - a[1])
      .slice(0, count)
      .map(([name]) => ({ name, selfPct: (100 * (selfUs.get(name) ?? 0)) / all, totalPct: (100 * (totalUs.get(name) ?? 0)) / all }));
  return { self: rank(selfUs), total: rank(totalUs), sampledS: all / 1e6 };
}
