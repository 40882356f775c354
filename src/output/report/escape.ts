/**
 * Escaping for the report. Every piece of user text (titles, ids, labels, warnings) goes through escapeHtml
 * before it is put into the page, so markup in a title shows as text. Chart SVG is made by vega, which
 * escapes its own text; checkedSvg still refuses anything that could run script before it is inlined.
 */

const entities: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text → HTML text or attribute value (both quote kinds escaped). */
export function escapeHtml(text: unknown): string {
  return String(text ?? '').replace(/[&<>"']/g, (c) => entities[c] as string);
}

/**
 * An SVG document fit to inline: starts with <svg (an XML prologue or doctype is dropped), and has no script,
 * foreignObject, event-handler attribute or javascript: link. Throws a RangeError otherwise: a chart that
 * fails this was not made by gvf's renderer.
 */
export function checkedSvg(svg: string): string {
  const body = svg.replace(/^\uFEFF?\s*(<\?xml[^>]*\?>\s*)?(<!DOCTYPE[^>]*>\s*)?/i, '').trim();
  if (!/^<svg[\s>]/.test(body) || !/<\/svg>$/.test(body)) throw new RangeError('chart SVG must be one <svg> element');
  if (/<\s*(script|foreignObject|iframe|object|embed)\b/i.test(body)) throw new RangeError('chart SVG contains an element that can run code');
  for (const tag of body.match(/<[a-zA-Z][^>]*>/g) ?? []) {
    // attribute values are quoted and escaped; look only at the attribute names and unquoted parts
    const bare = tag.replace(/"[^"]*"|'[^']*'/g, '""');
    if (/\son[a-z]+\s*=/i.test(bare)) throw new RangeError('chart SVG contains an event-handler attribute');
  }
  if (/(href)\s*=\s*["']\s*javascript:/i.test(body)) throw new RangeError('chart SVG contains a javascript: link');
  return body;
}
