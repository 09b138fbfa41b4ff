/**
 * The Settings field's text ("3, 1" or "3 1") as numbers. Anything that is not a plain number stays NaN,
 * so the shared schema (reminderDaysSchema) reports it in the field rather than this parser guessing.
 */
export function parseReminderDays(text: string): number[] {
  return text
    .split(/[\s,;]+/)
    .filter((part) => part !== '')
    .map((part) => (/^-?\d+(\.\d+)?$/.test(part) ? Number(part) : Number.NaN));
}
