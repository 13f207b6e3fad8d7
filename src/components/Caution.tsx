import { memo } from 'react';

/** The standing caution, shown in the app and on any printed summary. */
export const CAUTION_TEXT =
  'An analysis aid, not investment advice. Forwards are what today\u2019s prices imply, not forecasts. Verify against official sources and your own policies.';

export const Caution = memo(function Caution() {
  return (
    <p className="caution" role="note" aria-label="Caution">
      <strong>Caution.</strong> {CAUTION_TEXT}
    </p>
  );
});
