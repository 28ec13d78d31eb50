/**
 * A strict, small XML 1.0 well-formedness checker and tree reader for the SVG tests (written for
 * the tests; no dependency). It accepts the subset an SVG generator needs: elements, attributes,
 * text, comments and an optional XML declaration, and refuses what the XML 1.0 specification
 * (W3C Recommendation, fifth edition, 2008: productions element, Attribute, CharData, Reference,
 * Comment, Char) makes ill-formed: unbalanced or crossed tags, a second root, text outside the root,
 * unquoted or duplicate attributes, `<` in an attribute value, a bare `&` or an unknown entity,
 * `--` inside a comment, `]]>` in text, and characters outside Char. DOCTYPE, CDATA and processing
 * instructions are refused too (the generator never writes them). Each error names its offset.
 */

export interface XmlElement {
  name: string;
  attributes: Record<string, string>;
  children: XmlElement[];
  /** Concatenated text directly inside this element (entities decoded). */
  text: string;
}

export class XmlError extends Error {
  constructor(readonly offset: number, message: string) {
    super(`offset ${offset}: ${message}`);
  }
}

const NAME = /[A-Za-z_:][A-Za-z0-9._:\-]*/y;
const SPACE = /[ \t\r\n]*/y;
const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

function isXmlChar(code: number): boolean {
  return code === 0x9 || code === 0xa || code === 0xd || (code >= 0x20 && code <= 0xd7ff) || (code >= 0xe000 && code <= 0xfffd) || (code >= 0x10000 && code <= 0x10ffff);
}

function decode(raw: string, at: number): string {
  return raw.replace(/&([^;]*);|&/g, (m, body: string | undefined, offset: number) => {
    if (body === undefined) throw new XmlError(at + offset, 'a bare "&" (write &amp;)');
    if (body in ENTITIES) return ENTITIES[body]!;
    const num = /^#(?:x([0-9A-Fa-f]+)|([0-9]+))$/.exec(body);
    if (!num) throw new XmlError(at + offset, `unknown entity "&${body};"`);
    const code = num[1] !== undefined ? parseInt(num[1], 16) : Number(num[2]);
    if (!isXmlChar(code)) throw new XmlError(at + offset, `character reference to a non-character ${m}`);
    return String.fromCodePoint(code);
  });
}

/** Parses `text` as a well-formed XML document and returns its root element; throws XmlError otherwise. */
export function parseXml(text: string): XmlElement {
  for (let i = 0; i < text.length; i++) {
    const code = text.codePointAt(i)!;
    if (!isXmlChar(code)) throw new XmlError(i, `character U+${code.toString(16).toUpperCase()} is not allowed in XML`);
    if (code > 0xffff) i++;
  }
  let pos = 0;
  const skip = () => {
    SPACE.lastIndex = pos;
    SPACE.exec(text);
    pos = SPACE.lastIndex;
  };
  const name = (): string => {
    NAME.lastIndex = pos;
    const m = NAME.exec(text);
    if (!m) throw new XmlError(pos, 'expected a name');
    pos = NAME.lastIndex;
    return m[0];
  };
  if (text.startsWith('<?xml')) {
    const end = text.indexOf('?>');
    if (end < 0) throw new XmlError(0, 'unterminated XML declaration');
    pos = end + 2;
  }
  const stack: XmlElement[] = [];
  let root: XmlElement | null = null;
  while (pos < text.length) {
    const lt = text.indexOf('<', pos);
    const chunk = text.slice(pos, lt < 0 ? text.length : lt);
    if (chunk.length > 0) {
      if (chunk.includes(']]>')) throw new XmlError(pos + chunk.indexOf(']]>'), '"]]>" in text');
      const decoded = decode(chunk, pos);
      if (stack.length === 0) {
        if (decoded.trim() !== '') throw new XmlError(pos, 'text outside the root element');
      } else stack[stack.length - 1]!.text += decoded;
    }
    if (lt < 0) break;
    pos = lt;
    if (text.startsWith('<!--', pos)) {
      const end = text.indexOf('-->', pos + 4);
      if (end < 0) throw new XmlError(pos, 'unterminated comment');
      const body = text.slice(pos + 4, end);
      if (body.includes('--') || body.endsWith('-')) throw new XmlError(pos, '"--" inside a comment');
      pos = end + 3;
      continue;
    }
    if (text.startsWith('<!', pos) || text.startsWith('<?', pos)) throw new XmlError(pos, 'DOCTYPE, CDATA and processing instructions are not expected here');
    if (text.startsWith('</', pos)) {
      pos += 2;
      const n = name();
      skip();
      if (text[pos] !== '>') throw new XmlError(pos, `expected ">" to close </${n}`);
      pos++;
      const open = stack.pop();
      if (!open) throw new XmlError(pos, `</${n}> closes nothing`);
      if (open.name !== n) throw new XmlError(pos, `</${n}> closes <${open.name}>`);
      continue;
    }
    pos++;
    const element: XmlElement = { name: name(), attributes: {}, children: [], text: '' };
    if (stack.length === 0) {
      if (root) throw new XmlError(lt, 'a second root element');
      root = element;
    } else stack[stack.length - 1]!.children.push(element);
    for (;;) {
      const before = pos;
      skip();
      if (text.startsWith('/>', pos)) {
        pos += 2;
        break;
      }
      if (text[pos] === '>') {
        pos++;
        stack.push(element);
        break;
      }
      if (pos === before) throw new XmlError(pos, `expected white space, ">" or "/>" in <${element.name}>`);
      const attr = name();
      if (attr in element.attributes) throw new XmlError(pos, `attribute ${attr} given twice in <${element.name}>`);
      skip();
      if (text[pos] !== '=') throw new XmlError(pos, `attribute ${attr} needs ="value"`);
      pos++;
      skip();
      const quote = text[pos];
      if (quote !== '"' && quote !== "'") throw new XmlError(pos, `attribute ${attr} needs a quoted value`);
      const end = text.indexOf(quote, pos + 1);
      if (end < 0) throw new XmlError(pos, `unterminated value of ${attr}`);
      const raw = text.slice(pos + 1, end);
      if (raw.includes('<')) throw new XmlError(pos, `"<" in the value of ${attr}`);
      element.attributes[attr] = decode(raw, pos + 1);
      pos = end + 1;
    }
  }
  if (stack.length > 0) throw new XmlError(text.length, `<${stack[stack.length - 1]!.name}> is never closed`);
  if (!root) throw new XmlError(0, 'no root element');
  return root;
}

/** Every element of the tree, depth first. */
export function allElements(root: XmlElement): XmlElement[] {
  return [root, ...root.children.flatMap(allElements)];
}

/** Elements whose class list holds `cls`. */
export function byClass(root: XmlElement, cls: string): XmlElement[] {
  return allElements(root).filter((e) => (e.attributes.class ?? '').split(/\s+/).includes(cls));
}

/** Text of an element and all its descendants. */
export function deepText(e: XmlElement): string {
  return e.text + e.children.map(deepText).join('');
}
