// The bridge finder's search: the k best bridges of 1–3 inks between two inks that clash, over
// the catalogue graph (inks as nodes, every non-muddy join as an edge weighted by its ΔE2000).
// Pure functions over plain arrays, so tests can check them against brute-force enumeration.
//
// A bridge is better when (1) its largest step is smaller (minimax), then (2) its steps add up
// to less, then (3) it has fewer inks, then (4) its ink indices read earlier (only so that the
// order is total and the answer reproducible).
//
// k best: Yen's algorithm (J. Y. Yen, 1971, "Finding the K shortest loopless paths in a
// network", Management Science 17(11), 712–716). Yen needs a "best path from the spur node"
// subroutine under the cost above; with a hop limit and the lexicographic (max, sum, hops)
// cost, a plain Dijkstra is not exact, so the subroutine is two exact layered dynamic
// programmes (Bellman–Ford style, one layer per step): first the smallest possible largest
// step B*, then — among paths whose every step is ≤ max(B*, the root's largest step) — the
// smallest sum. A path with a repeated ink is never best (cutting the loop out lowers or keeps
// the max and the sum and drops a step), so the programmes may relax over walks.
import { labToDensity, type Density } from "../../../shared/colour/blend";
import { deltaE2000, type Lab } from "../../../shared/colour";
import { isMuddy, middleChroma } from "../../../shared/colour/joins";

/**
 * ΔE2000 of every pair, Infinity where the join would be muddy (never an edge) and on the
 * diagonal; and each ink's joinable neighbours, nearest first, so "every neighbour within ΔE
 * cap" is a prefix read, not a scan of the whole row.
 */
export type JoinMatrix = { n: number; w: Float32Array; near: Uint32Array[] };

/** n² ΔE2000 and muddy checks; about a second for 2 000 inks, so callers cache it per catalogue. */
export function buildJoinMatrix(labs: Lab[]): JoinMatrix {
  const n = labs.length;
  const w = new Float32Array(n * n).fill(Infinity);
  const dens: Density[] = labs.map(labToDensity);
  const chroma = labs.map((l) => Math.hypot(l.a, l.b));
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (isMuddy(chroma[i]!, chroma[j]!, middleChroma(dens[i]!, dens[j]!))) continue;
      const d = deltaE2000(labs[i]!, labs[j]!);
      w[i * n + j] = d;
      w[j * n + i] = d;
    }
  }
  const near: Uint32Array[] = [];
  for (let i = 0; i < n; i++) {
    const row = w.subarray(i * n, (i + 1) * n);
    const list: number[] = [];
    for (let j = 0; j < n; j++) if (row[j]! < Infinity) list.push(j);
    near.push(Uint32Array.from(list.sort((a, b) => row[a]! - row[b]!)));
  }
  return { n, w, near };
}

export type BridgeQuery = {
  from: number;
  to: number;
  /** Inks that may stand between the two (by index); the ends need not be in it. */
  allowed: (i: number) => boolean;
  /** Inks the member would have to buy (by index), and how many of those a bridge may hold. */
  mustBuy?: (i: number) => boolean;
  maxBuys?: number;
  /** 1–3 inks between the ends. */
  maxBetween?: number;
  k: number;
};

export type Bridge = {
  /** Ink indices, ends included. */
  nodes: number[];
  maxStep: number;
  total: number;
};

/** The path cost, always summed from the start so brute force and Yen's agree to the bit. */
function costOf(m: JoinMatrix, nodes: number[]): { maxStep: number; total: number } {
  let maxStep = 0;
  let total = 0;
  for (let i = 1; i < nodes.length; i++) {
    const d = m.w[nodes[i - 1]! * m.n + nodes[i]!]!;
    if (d > maxStep) maxStep = d;
    total += d;
  }
  return { maxStep, total };
}

export function compareBridges(a: Bridge, b: Bridge): number {
  if (a.maxStep !== b.maxStep) return a.maxStep - b.maxStep;
  if (a.total !== b.total) return a.total - b.total;
  if (a.nodes.length !== b.nodes.length) return a.nodes.length - b.nodes.length;
  for (let i = 0; i < a.nodes.length; i++) if (a.nodes[i] !== b.nodes[i]) return a.nodes[i]! - b.nodes[i]!;
  return 0;
}

function toBridge(m: JoinMatrix, nodes: number[]): Bridge {
  return { nodes, ...costOf(m, nodes) };
}

/** Every bridge, sorted best first: the reference the tests hold the search to (small catalogues only). */
export function bruteForceBridges(m: JoinMatrix, q: BridgeQuery): Bridge[] {
  const maxBetween = q.maxBetween ?? 3;
  const maxBuys = q.maxBuys ?? Infinity;
  const out: Bridge[] = [];
  const walk = (path: number[], buys: number) => {
    const last = path[path.length - 1]!;
    if (path.length >= 2 && m.w[last * m.n + q.to]! < Infinity) out.push(toBridge(m, [...path, q.to]));
    if (path.length - 1 >= maxBetween) return;
    for (let v = 0; v < m.n; v++) {
      if (v === q.from || v === q.to || path.includes(v) || !q.allowed(v)) continue;
      if (!(m.w[last * m.n + v]! < Infinity)) continue;
      const b = buys + (q.mustBuy?.(v) ? 1 : 0);
      if (b > maxBuys) continue;
      walk([...path, v], b);
    }
  };
  walk([q.from], 0);
  return out.sort(compareBridges).slice(0, q.k);
}

/** The part of the graph a search looks at: local ids 0…L−1, adjacency lists of edges ≤ cap. */
type LocalGraph = { global: number[]; adj: Int32Array[]; wt: Float64Array[] };

function localGraph(m: JoinMatrix, q: BridgeQuery, nodes: number[], cap: number): LocalGraph {
  const global = [q.from, q.to, ...nodes.filter((v) => v !== q.from && v !== q.to && q.allowed(v))];
  const local = new Int32Array(m.n).fill(-1);
  global.forEach((v, i) => (local[v] = i));
  const adj: Int32Array[] = [];
  const wt: Float64Array[] = [];
  for (let i = 0; i < global.length; i++) {
    const u = global[i]!;
    const row = u * m.n;
    const a: number[] = [];
    const w: number[] = [];
    for (const v of m.near[u]!) {
      const d = m.w[row + v]!;
      if (d > cap) break;
      const j = local[v]!;
      if (j < 0 || (i < 2 && j < 2)) continue; // outside the search, or the direct join being bridged
      a.push(j);
      w.push(d);
    }
    adj.push(Int32Array.from(a));
    wt.push(Float64Array.from(w));
  }
  return { global, adj, wt };
}

type Spur = {
  g: LocalGraph;
  blockedNode: Uint8Array;
  /** Edges out of the spur node that earlier bridges with the same root already took. */
  blockedFirst: Set<number>;
  start: number;
  hops: number;
  /** Largest step and inks bought along the root path. */
  rootMax: number;
  buysLeft: number;
  mustBuy: Uint8Array;
};

// Local ids of the ends.
const FROM = 0;
const TARGET = 1;

/**
 * The best spur path (local ids) from `start` to the target in at most `hops` steps, given the
 * root's largest step, or null. Layered DP over (ink, inks bought); the target is only ever a
 * last step.
 */
function bestSpur(s: Spur): number[] | null {
  const { g } = s;
  const L = g.global.length;
  const limited = Number.isFinite(s.buysLeft);
  const B = limited ? s.buysLeft + 1 : 1;
  const size = L * B;
  const open = (u: number, v: number) => !s.blockedNode[v] && !(u === s.start && s.blockedFirst.has(v));

  // Phase 1: the smallest possible largest step.
  let cur = new Float64Array(size).fill(Infinity);
  cur[s.start * B] = 0;
  for (let h = 1; h <= s.hops; h++) {
    const next = Float64Array.from(cur);
    for (let u = 0; u < L; u++) {
      if (u === TARGET) continue;
      for (let b = 0; b < B; b++) {
        const cu = cur[u * B + b]!;
        if (cu === Infinity) continue;
        const adj = g.adj[u]!;
        const wt = g.wt[u]!;
        for (let e = 0; e < adj.length; e++) {
          const v = adj[e]!;
          if (!open(u, v)) continue;
          if (v !== TARGET && h === s.hops) continue;
          const nb = v === TARGET || !limited ? 0 : b + s.mustBuy[v]!;
          if (nb >= B) continue;
          const c = cu > wt[e]! ? cu : wt[e]!;
          if (c < next[v * B + nb]!) next[v * B + nb] = c;
        }
      }
    }
    cur = next;
  }
  const bestMax = cur[TARGET * B]!;
  if (bestMax === Infinity) return null;
  const cap = Math.max(bestMax, s.rootMax);

  // Phase 2: among spurs with every step ≤ cap, the smallest sum, then the fewest steps.
  const pred: Int32Array[] = [new Int32Array(size).fill(-1)];
  let cs = new Float64Array(size).fill(Infinity);
  let ch = new Int32Array(size);
  cs[s.start * B] = 0;
  for (let h = 1; h <= s.hops; h++) {
    const ns = Float64Array.from(cs);
    const nh = Int32Array.from(ch);
    const np = new Int32Array(size).fill(-2); // -2: carried over from the layer before
    for (let u = 0; u < L; u++) {
      if (u === TARGET) continue;
      for (let b = 0; b < B; b++) {
        const from = u * B + b;
        if (cs[from] === Infinity) continue;
        const adj = g.adj[u]!;
        const wt = g.wt[u]!;
        for (let e = 0; e < adj.length; e++) {
          const v = adj[e]!;
          const d = wt[e]!;
          if (d > cap || !open(u, v)) continue;
          if (v !== TARGET && h === s.hops) continue;
          const nb = v === TARGET || !limited ? 0 : b + s.mustBuy[v]!;
          if (nb >= B) continue;
          const to = v * B + nb;
          const c = cs[from]! + d;
          const hh = ch[from]! + 1;
          if (c < ns[to]! || (c === ns[to]! && hh < nh[to]!)) {
            ns[to] = c;
            nh[to] = hh;
            np[to] = from;
          }
        }
      }
    }
    cs = ns;
    ch = nh;
    pred.push(np);
  }
  // Walk the predecessors back from the target at the last layer.
  const path: number[] = [];
  let at = TARGET * B;
  for (let h = s.hops; h >= 1; h--) {
    const p = pred[h]![at]!;
    if (p === -2) continue;
    path.push(Math.floor(at / B));
    at = p;
  }
  path.push(Math.floor(at / B));
  path.reverse();
  return path[0] === s.start ? path : null;
}

/**
 * The k best bridges (Yen 1971, see the top of this file) among the inks `nodes` (all inks when
 * left out), using only steps ≤ cap.
 */
export function kBestBridges(m: JoinMatrix, q: BridgeQuery, nodes?: number[], cap = Infinity): Bridge[] {
  const maxBetween = q.maxBetween ?? 3;
  const maxBuys = q.maxBuys ?? Infinity;
  const g = localGraph(m, q, nodes ?? Array.from({ length: m.n }, (_, i) => i), cap);
  const L = g.global.length;
  const mustBuy = new Uint8Array(L);
  if (q.mustBuy) for (let i = 2; i < L; i++) mustBuy[i] = q.mustBuy(g.global[i]!) ? 1 : 0;
  const toGlobal = (path: number[]) => toBridge(m, path.map((v) => g.global[v]!));
  const stepOf = (a: number, b: number) => {
    const adj = g.adj[a]!;
    for (let e = 0; e < adj.length; e++) if (adj[e] === b) return g.wt[a]![e]!;
    return Infinity;
  };
  const first = bestSpur({ g, mustBuy, blockedNode: new Uint8Array(L), blockedFirst: new Set(), start: FROM, hops: maxBetween + 1, rootMax: 0, buysLeft: maxBuys });
  if (!first) return [];
  const found: { local: number[]; bridge: Bridge }[] = [{ local: first, bridge: toGlobal(first) }];
  const pending: { local: number[]; bridge: Bridge }[] = [];
  const seen = new Set<string>([first.join(",")]);
  while (found.length < q.k) {
    const last = found[found.length - 1]!.local;
    for (let i = 0; i < last.length - 1; i++) {
      const root = last.slice(0, i + 1);
      const blockedFirst = new Set<number>();
      for (const p of found) {
        if (p.local.length > i + 1 && root.every((v, j) => p.local[j] === v)) blockedFirst.add(p.local[i + 1]!);
      }
      const blockedNode = new Uint8Array(L);
      for (const v of root) blockedNode[v] = 1;
      let rootMax = 0;
      let buys = 0;
      for (let j = 1; j < root.length; j++) {
        rootMax = Math.max(rootMax, stepOf(root[j - 1]!, root[j]!));
        buys += mustBuy[root[j]!]!;
      }
      const spur = bestSpur({ g, mustBuy, blockedNode, blockedFirst, start: root[i]!, hops: maxBetween + 1 - i, rootMax, buysLeft: maxBuys - buys });
      if (!spur) continue;
      const local = [...root.slice(0, -1), ...spur];
      const id = local.join(",");
      if (seen.has(id)) continue;
      seen.add(id);
      pending.push({ local, bridge: toGlobal(local) });
    }
    if (!pending.length) break;
    pending.sort((a, b) => compareBridges(a.bridge, b.bridge));
    found.push(pending.shift()!);
  }
  return found.map((f) => f.bridge);
}

/**
 * Inks within reach: those a bridge with every step ≤ cap could pass through (reached from
 * `from` and reaching `to` within the hop limit).
 */
export function inksWithinReach(m: JoinMatrix, q: BridgeQuery, cap: number): number[] {
  const maxBetween = q.maxBetween ?? 3;
  const { n, w } = m;
  const hopsFrom = (start: number) => {
    const dist = new Int32Array(n).fill(99);
    dist[start] = 0;
    let frontier = [start];
    for (let h = 1; h <= maxBetween && frontier.length; h++) {
      const next: number[] = [];
      for (const u of frontier) {
        const row = u * n;
        for (const v of m.near[u]!) {
          if (w[row + v]! > cap) break;
          if (dist[v]! <= h || v === q.from || v === q.to || !q.allowed(v)) continue;
          dist[v] = h;
          next.push(v);
        }
      }
      frontier = next;
    }
    return dist;
  };
  const a = hopsFrom(q.from);
  const b = hopsFrom(q.to);
  const out: number[] = [];
  for (let v = 0; v < n; v++) if (a[v]! + b[v]! <= maxBetween + 1) out.push(v);
  return out;
}

/**
 * The k best bridges over the whole catalogue, looking at as little of it as it can. The k best
 * one-ink bridges bound the k-th best bridge's largest step by U. Starting from a cap well
 * below U, search only the steps ≤ cap (and the inks they reach); if that finds k bridges they
 * are the k best of the whole catalogue — every bridge left out has a step above the cap, so it
 * ranks after them — otherwise raise the cap, up to U, where k are certain to be found. Exact,
 * as the tests check against brute force.
 */
export function findBestBridges(m: JoinMatrix, q: BridgeQuery): Bridge[] {
  const { n, w } = m;
  const single: number[] = [];
  for (let v = 0; v < n; v++) {
    if (v === q.from || v === q.to || !q.allowed(v)) continue;
    if ((q.maxBuys ?? Infinity) < 1 && q.mustBuy?.(v)) continue;
    const c = Math.max(w[q.from * n + v]!, w[v * n + q.to]!);
    if (c < Infinity) single.push(c);
  }
  if (single.length < q.k) return kBestBridges(m, q);
  single.sort((a, b) => a - b);
  const U = single[q.k - 1]!;
  for (let cap = U / 2; ; cap = Math.min(U, cap * 1.08)) {
    const found = kBestBridges(m, q, inksWithinReach(m, q, cap), cap);
    if (found.length >= q.k || cap >= U) return found;
  }
}
