/**
 * The roll-versus-term fields by the names the panel shows, for messages: the core names a field by
 * its document path (`strategy.horizon`), a person by its label ("Horizon").
 */
const FIELD_LABEL: Readonly<Record<string, string>> = {
  'strategy.amount': 'Amount',
  'strategy.horizon': 'Horizon',
  'strategy.rollTenor': 'Roll tenor',
  'strategy.rollDayCount': 'Roll day count',
  'strategy.bondFrequency': 'Par bond to horizon',
  'strategy.ridingMaturity': 'Riding bond maturity',
  'strategy.ridingFrequency': 'Riding bond',
  'strategy.view': 'Chosen view',
  'strategy.shiftBp': 'Parallel shift',
  'strategy.path': 'Your path',
  'strategy.path.fill': 'Your path from',
  'strategy.path.constant': 'Constant rate',
  'strategy.path.rampFrom': 'Ramp from',
  'strategy.path.rampTo': 'Ramp to',
  'strategy.path.legs': 'Your path, leg by leg',
};

/** The field's label for a path (an unknown path becomes its last part, spaced: "rampTo" -> "ramp to"). */
export function fieldLabel(path: string): string {
  const known = FIELD_LABEL[path];
  if (known) return known;
  const last = path.split('.').pop() ?? path;
  return last.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
}

/** A core message with every `strategy.*` path replaced by its field's label ("Horizon: more than ..."). */
export function inFieldWords(message: string): string {
  return message.replace(/strategy(?:\.[A-Za-z]+)+/g, (path) => fieldLabel(path));
}
