// The browser's own phases of main-thread work in a DevTools trace (script,
// style, layout, paint), summed over the trace's complete events: each
// event counts under the outermost event of its phase, and time nested in
// an event of another phase counts under that phase (a layout forced
// inside a script call is layout). Used by `trace.js` (per edit, over a
// whole run) and `redraw.js` (per edit, from the input event to the
// settled page).

/** The phase a trace event's time counts under, or null for an event not counted. */
export function phase(name) {
  if (["FunctionCall", "EvaluateScript", "RunMicrotasks", "EventDispatch", "TimerFire", "FireAnimationFrame", "v8.callFunction"].includes(name)) return "script";
  if (["UpdateLayoutTree", "RecalculateStyles", "ParseAuthorStyleSheet"].includes(name)) return "style";
  if (["Layout", "UpdateLayerTree", "Layerize"].includes(name)) return "layout";
  if (["Paint", "PaintImage", "PrePaint", "RasterTask", "CompositeLayers", "Commit"].includes(name)) return "paint";
  return null;
}

/**
 * The time of the complete events of thread `tid` of process `pid` that lie
 * wholly between trace times `from` and `to` (microseconds), by phase, in
 * milliseconds: `{ wall: {phase: ms}, cpu: {phase: ms} }`, the CPU time
 * being the thread's own (the steadier figure on a shared machine).
 */
export function timeByPhase(events, { pid, tid }, from = -Infinity, to = Infinity) {
  const wall = {};
  const cpu = {};
  const open = [];
  const inside = events
    .filter((e) => e.ph === "X" && e.pid === pid && e.tid === tid && e.ts >= from && e.ts + (e.dur ?? 0) <= to)
    .sort((a, b) => a.ts - b.ts);
  for (const e of inside) {
    const kind = phase(e.name);
    if (!kind) continue;
    while (open.length && open.at(-1).end <= e.ts) open.pop();
    const parent = open.at(-1);
    if (parent && parent.kind === kind) continue;
    const ms = (e.dur ?? 0) / 1000;
    const own = (e.tdur ?? e.dur ?? 0) / 1000;
    wall[kind] = (wall[kind] ?? 0) + ms;
    cpu[kind] = (cpu[kind] ?? 0) + own;
    if (parent) {
      wall[parent.kind] -= ms;
      cpu[parent.kind] -= own;
    }
    open.push({ kind, end: e.ts + (e.dur ?? 0) });
  }
  return { wall, cpu };
}
