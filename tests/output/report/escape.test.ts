/** escapeHtml and checkedSvg: the five characters HTML gives meaning to (&, <, >, ", ') are escaped (HTML Living Standard, §13.1 syntax, common practice). */
import { describe, expect, it } from 'vitest';
import { checkedSvg, escapeHtml } from '../../../src/output/report/escape.js';

describe('escapeHtml(text)', () => {
  it('escapeHtml(text) escapes &, <, >, " and \' and nothing else', () => {
    expect(escapeHtml(`<a href="x" title='y'>Tom & Jerry</a>`)).toBe('&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;Tom &amp; Jerry&lt;/a&gt;');
    expect(escapeHtml('Stüßli Ø 1.2 m³/s — ok')).toBe('Stüßli Ø 1.2 m³/s — ok');
    expect(escapeHtml(null)).toBe('');
    expect(escapeHtml(3.5)).toBe('3.5');
  });
});

describe('checkedSvg(svg)', () => {
  const ok = '<svg xmlns="http://www.w3.org/2000/svg" width="2" height="2"><text aria-label="a onclick=x">&lt;script&gt;</text></svg>';
  it('checkedSvg(svg) passes an SVG whose text merely mentions markup, and drops an XML prologue', () => {
    expect(checkedSvg(ok)).toBe(ok);
    expect(checkedSvg(`<?xml version="1.0"?>\n${ok}`)).toBe(ok);
  });
  it('checkedSvg(svg) refuses script, foreignObject, event handlers, javascript: links and non-SVG', () => {
    expect(() => checkedSvg('<svg><script>alert(1)</script></svg>')).toThrow(/run code/);
    expect(() => checkedSvg('<svg><foreignObject><div/></foreignObject></svg>')).toThrow(/run code/);
    expect(() => checkedSvg('<svg><rect onload="alert(1)"/></svg>')).toThrow(/event-handler/);
    expect(() => checkedSvg('<svg><a href="javascript:alert(1)"><rect/></a></svg>')).toThrow(/javascript/);
    expect(() => checkedSvg('<div>not svg</div>')).toThrow(/one <svg>/);
  });
});
