import { formatBpSetting as bpText, type ScenarioShape } from '../../core/index.ts';

/** One line that says what a scenario's shape does, for lists and the printed page. */
export function describeShape(shape: ScenarioShape): string {
  switch (shape.kind) {
    case 'parallel':
      return `parallel ${bpText(shape.bp)}`;
    case 'twist':
      return `${shape.bp >= 0 ? 'steepener' : 'flattener'} ${shape.short}\u2013${shape.long} spread ${bpText(shape.bp)}, pivot ${shape.pivot}`;
    case 'butterfly':
      return `butterfly wings ${shape.short}, ${shape.long} ${bpText(shape.wingsBp)}, belly ${shape.belly} ${bpText(shape.bellyBp)}`;
    case 'key-rate':
      return `key rates ${shape.points.map((p) => `${p.at} ${bpText(p.bp)}`).join(', ')}`;
  }
}

export const SPACE_LABEL = { zero: 'zero curve', quotes: 'quotes, re-bootstrapped' } as const;
