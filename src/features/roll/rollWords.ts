/**
 * The roll panel's field names for the document paths that core messages carry
 * (`strategy.ridingMaturity: ...`): messages are shown in the words of the panel's own labels.
 */
const FIELD_LABEL: Readonly<Record<string, string>> = {
  amount: 'Amount',
  horizon: 'Horizon',
  rollTenor: 'Roll tenor',
  rollDayCount: 'Roll day count',
  bondFrequency: 'Par bond to horizon',
  ridingMaturity: 'Riding bond maturity',
  ridingFrequency: 'Riding bond coupons',
  view: 'Chosen view',
  shiftBp: 'Parallel shift',
  path: 'Your path',
  'path.fill': 'Your path from',
  'path.constant': 'Constant rate',
  'path.rampFrom': 'Ramp from',
  'path.rampTo': 'Ramp to',
  'path.legs': 'Rates typed per leg',
};

const PATH = /\bstrategy\.([A-Za-z]+(?:\.[A-Za-z]+)?)(?:\[(\d+)\])?/g;

/** Replaces every `strategy.<field>` path in a message by the field's label (a leg index as "leg n", counted from 1). */
export function rollWords(message: string): string {
  return message.replace(PATH, (_all, key: string, index: string | undefined) => {
    const label = FIELD_LABEL[key] ?? FIELD_LABEL[key.split('.')[0]!] ?? key;
    return index === undefined ? label : `${label}, leg ${Number(index) + 1}`;
  });
}
