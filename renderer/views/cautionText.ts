/** Every screen and the sheet preview carry this line: the numbers support a decision, they do not make it. */
export const cautionText =
  'Decision support only: every number here is for review by the prescriber, who decides together with local protocols. Check each value against the record before relying on it.';
