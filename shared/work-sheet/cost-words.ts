/**
 * A lead change's cost as the restorer reads it. The engine says "none: X has no hands-free add-on (it can no
 * longer take one)", which names no cost and a loss in one breath; here the loss today and the loss later are
 * stated apart, so the line never contradicts itself.
 */
const NO_ADD_ON = /^none(?: today)?: (.+) has no hands-free add-on \(it can no longer take one\)\.?$/i;

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** The cure's brief cost, or the sheet's sentence, as one consistent sentence (capitalised, with a full stop). */
export function costWords(cost: string): string {
  const noAddOn = NO_ADD_ON.exec(cost.trim());
  if (noAddOn)
    return `Nothing stops working today (${noAddOn[1]} has no hands-free add-on), but ${noAddOn[1]} could not take one later without putting the leads back.`;
  const text = capital(cost.trim());
  return /[.!?]$/.test(text) ? text : `${text}.`;
}
