/** "2026-12-02 14:05 UTC": the same text on the server and in the browser, as in the PDF. */
export function formatUtc(iso: string): string {
  return `${iso.slice(0, 16).replace('T', ' ')} UTC`
}
