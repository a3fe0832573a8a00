/** Text safe inside HTML element content and quoted attributes (mail bodies carry user-entered names). */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}
