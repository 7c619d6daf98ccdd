/**
 * A label inside a sentence: the first letter lowered when it starts an ordinary word ("Sub-tropical
 * (12–20 °C)" → "sub-tropical (12–20 °C)"), kept for a symbol or an acronym ("Ag/AgCl", "ROV", "°C").
 */
export function inSentence(label: string): string {
  const firstWord = label.split(/[\s,(]/, 1)[0]!;
  return /^[A-Z][a-z-]*$/.test(firstWord) ? label.charAt(0).toLowerCase() + label.slice(1) : label;
}
