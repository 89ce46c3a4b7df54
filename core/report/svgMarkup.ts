/**
 * SVG as text: elements with escaped attributes and text, coordinates written
 * to two decimals so the same input always gives the same bytes.
 */

/** Attribute values; undefined and false leave the attribute out. */
export type SvgAttributes = Readonly<Record<string, string | number | undefined | false>>;

const escapes: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text safe inside an SVG element or attribute. @example escapeXml('a < b & c') === 'a &lt; b &amp; c' */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (character) => escapes[character]!);
}

/** A coordinate or length to at most two decimals, without '-0'. @example coordinate(1.23456) === '1.23' */
export function coordinate(value: number): string {
  const rounded = Math.round(value * 100) / 100;
  return String(rounded === 0 ? 0 : rounded);
}

/** One element; numbers are written with `coordinate`, children are already markup. */
export function element(name: string, attributes: SvgAttributes = {}, children: readonly string[] | string = []): string {
  const attributeText = Object.entries(attributes)
    .filter(([, value]) => value !== undefined && value !== false)
    .map(([key, value]) => ` ${key}="${typeof value === 'number' ? coordinate(value) : escapeXml(String(value))}"`)
    .join('');
  const content = typeof children === 'string' ? children : children.join('');
  return content === '' ? `<${name}${attributeText}/>` : `<${name}${attributeText}>${content}</${name}>`;
}

/** A text element (its content escaped). */
export function textElement(content: string, attributes: SvgAttributes): string {
  return element('text', attributes, escapeXml(content));
}
