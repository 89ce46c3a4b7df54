import { DOMParser, type Element } from '@xmldom/xmldom';
import { expect } from 'vitest';

/** Parse chart SVG with a general XML parser (@xmldom/xmldom): a malformed string fails the test. */
export function parseSvg(svg: string): Element {
  const document = new DOMParser({ onError: (level, message) => { throw new Error(`${level}: ${message}`); } }).parseFromString(svg, 'image/svg+xml');
  const root = document.documentElement;
  expect(root?.tagName).toBe('svg');
  return root as unknown as Element;
}

/** Every element below `root` (depth first), optionally with one tag name. */
export function descendants(root: Element, tagName?: string): Element[] {
  const found: Element[] = [];
  const walk = (node: Element) => {
    for (let child = node.firstChild; child; child = child.nextSibling) {
      if (child.nodeType !== 1) continue;
      const childElement = child as unknown as Element;
      if (tagName === undefined || childElement.tagName === tagName) found.push(childElement);
      walk(childElement);
    }
  };
  walk(root);
  return found;
}

export function byAttribute(root: Element, name: string, value?: string): Element[] {
  return descendants(root).filter((node) => node.hasAttribute(name) && (value === undefined || node.getAttribute(name) === value));
}

/** The vertices of an SVG path made of M/L commands with absolute coordinates (what d3-shape's line and area write). */
export function pathVertices(d: string): [number, number][] {
  expect(d).toMatch(/^M[-\d.,LZ]+$/);
  return [...d.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((match) => [Number(match[1]), Number(match[2])]);
}

/** Each colour an attribute names is a grey (#rrggbb with r = g = b) or a pattern: meaning never rests on hue. */
export function expectGreyscale(svg: string): void {
  const colours = [...svg.matchAll(/(?:fill|stroke)="([^"]+)"/g)].map((match) => match[1]!);
  for (const colour of colours) {
    if (colour === 'none' || colour.startsWith('url(#')) continue;
    const hex = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(colour);
    expect(hex, colour).not.toBeNull();
    expect(hex![1]).toBe(hex![2]);
    expect(hex![2]).toBe(hex![3]);
  }
}

/** The affine map value → y the y-axis ticks show, recovered from two ticks. */
export function yOfValueFromTicks(svg: Element): (value: number) => number {
  const ticks = byAttribute(byAttribute(svg, 'data-role', 'y-axis')[0]!, 'data-tick').map((tick) => {
    const mark = descendants(tick, 'line')[0]!;
    return { value: Number(tick.getAttribute('data-tick')), y: Number(mark.getAttribute('y1')) };
  });
  expect(ticks.length).toBeGreaterThanOrEqual(3);
  const first = ticks[0]!;
  const last = ticks[ticks.length - 1]!;
  const slope = (last.y - first.y) / (last.value - first.value);
  return (value) => first.y + (value - first.value) * slope;
}
