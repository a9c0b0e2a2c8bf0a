/** The addresses in what was pasted: one per line, or separated by commas, semicolons or spaces. */
export function pastedAddresses(text: string): string[] {
  return text
    .split(/[\s,;]+/)
    .map((part) => part.trim())
    .filter(Boolean);
}
