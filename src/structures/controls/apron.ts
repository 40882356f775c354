/**
 * After the run: where the jump below a gate, spillway, weir or drop formed, from the engine's specific-force
 * balance, added to the structure's result — the toe station and its distance below the structure, the jump
 * length, whether the jump stays on the apron (toe distance + length ≤ apron length), or that it is drowned
 * up to the structure, or swept out of the channel.
 */
import type { FlowResult, StructureResult } from '../../results/types.js';

function show(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Number(value.toPrecision(6)));
}

/** The structure results of a flow with the jump below each placed (results of other kinds unchanged). */
export function withJumpPositions(flow: FlowResult, apronLengths: ReadonlyMap<string, number>): StructureResult[] {
  const results = flow.structures ?? [];
  const stations = results.map((r) => r.station).sort((a, b) => a - b);
  return results.map((r) => {
    if (!('downstreamSupercriticalDepth' in r.values) || r.values['downstreamSupercriticalDepth'] === null) return r;
    const next = stations.find((s) => s > r.station) ?? Infinity;
    const jump = flow.jumps.find((j) => j.station >= r.station && j.station < next);
    const apron = apronLengths.get(r.id);
    const drowned = (flow.notes ?? []).some((n) => n.startsWith('The jump is drowned up to') && n.includes(`'${r.id}'`));
    const below = flow.stations.filter((s) => s.station > r.station && s.station < next);
    const leavesSupercritical = below.length > 0 && below[below.length - 1]!.regime === 'supercritical';
    let where: string;
    const values: Record<string, number | string | boolean | null> = {};
    if (jump) {
      const distance = jump.station - r.station;
      values['jumpToeStation'] = jump.station;
      values['jumpToeDistanceBelowStructure'] = distance;
      values['jumpUpstreamDepth'] = jump.upstreamDepth;
      values['jumpSequentDepth'] = jump.downstreamDepth;
      values['jumpFroude'] = jump.froude;
      values['jumpLengthFromProfile'] = jump.length;
      values['jumpEndsBelowStructure'] = distance + jump.length;
      if (apron !== undefined) values['jumpStaysOnApron'] = distance + jump.length <= apron;
      where =
        apron === undefined
          ? `the jump forms ${show(distance)} below the structure (toe at station ${show(jump.station)})`
          : distance + jump.length <= apron
            ? `the jump forms ${show(distance)} below the toe and ends within the ${show(apron)} apron`
            : `the jump forms ${show(distance)} below the toe and reaches ${show(distance + jump.length)}: beyond the ${show(apron)} apron`;
    } else if (drowned) {
      values['jumpToeDistanceBelowStructure'] = 0;
      if (apron !== undefined) values['jumpStaysOnApron'] = true;
      where = 'the tailwater drowns the jump up to the structure (it forms at the toe, submerged)';
    } else if (leavesSupercritical) {
      if (apron !== undefined) values['jumpStaysOnApron'] = false;
      where = 'no jump forms in the channel below: the flow is swept out supercritical';
    } else {
      where = 'no jump located below the structure';
    }
    values['jumpPosition'] = where;
    const notes = [...r.notes];
    notes.splice(Math.max(notes.length - 1, 0), 0, `from the profile: ${where}`);
    return { ...r, values: { ...r.values, ...values }, notes };
  });
}
