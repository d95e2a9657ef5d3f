/**
 * A strict well-formedness check for the SVG we write (no general-purpose XML
 * parser is installed): one root element, tags that nest and close, quoted
 * and unique attributes, and `&` only in entity references. It accepts the
 * subset of XML that SVG output uses (no DOCTYPE, CDATA or processing
 * instructions other than an opening <?xml …?>), and rejects everything else.
 */
const NAME = '[A-Za-z_][\\w.:-]*';
const ATTRIBUTE = new RegExp(`\\s+(${NAME})\\s*=\\s*("[^"<]*"|'[^'<]*')`, 'y');
const START = new RegExp(`<(${NAME})`, 'y');
const START_END = /\s*(\/?)>/y;
const END = new RegExp(`</(${NAME})\\s*>`, 'y');
const COMMENT = /<!--(?:(?!--)[\s\S])*-->/y;
const PROLOG = /<\?xml[^?]*\?>/y;
const TEXT = /[^<]+/y;
const BAD_AMPERSAND = /&(?!(?:amp|lt|gt|quot|apos|#\d+|#x[0-9a-fA-F]+);)/;
// XML 1.0 forbids C0 controls other than tab, LF and CR
// biome-ignore lint/suspicious/noControlCharactersInRegex: matching the forbidden control characters is the point
const BAD_CHARACTER = /[\u0000-\u0008\u000B\u000C\u000E-\u001F]/;

function at(pattern: RegExp, text: string, index: number): RegExpExecArray | null {
  pattern.lastIndex = index;
  return pattern.exec(text);
}

/** Problems that make `text` not well-formed XML (empty when it is). */
export function xmlProblems(text: string): string[] {
  const problems: string[] = [];
  const open: string[] = [];
  let roots = 0;
  let i = 0;
  if (BAD_CHARACTER.test(text)) problems.push('a control character XML does not allow');
  const prolog = at(PROLOG, text, 0);
  if (prolog) i = prolog[0].length;
  while (i < text.length && problems.length === 0) {
    const comment = at(COMMENT, text, i);
    if (comment) {
      i += comment[0].length;
      continue;
    }
    let m = at(END, text, i);
    if (m) {
      const expected = open.pop();
      if (expected !== m[1]) problems.push(`</${m[1]}> at ${i} closes <${expected ?? 'nothing'}>`);
      i += m[0].length;
      continue;
    }
    m = at(START, text, i);
    if (m) {
      const name = m[1];
      if (open.length === 0 && ++roots > 1) problems.push(`second root element <${name}> at ${i}`);
      i += m[0].length;
      const seen = new Set<string>();
      for (let a = at(ATTRIBUTE, text, i); a; a = at(ATTRIBUTE, text, i)) {
        if (seen.has(a[1])) problems.push(`attribute ${a[1]} twice in <${name}> at ${i}`);
        if (BAD_AMPERSAND.test(a[2])) problems.push(`bare & in attribute ${a[1]} of <${name}> at ${i}`);
        seen.add(a[1]);
        i += a[0].length;
      }
      const close = at(START_END, text, i);
      if (!close) {
        problems.push(`malformed tag <${name}> at ${i}`);
        break;
      }
      if (close[1] !== '/') open.push(name);
      i += close[0].length;
      continue;
    }
    m = at(TEXT, text, i);
    if (m) {
      if (open.length === 0 && m[0].trim() !== '') problems.push(`text outside the root element at ${i}`);
      if (BAD_AMPERSAND.test(m[0])) problems.push(`bare & in text at ${i}`);
      i += m[0].length;
    } else {
      problems.push(`unexpected markup at ${i}: ${text.slice(i, i + 20)}`);
    }
  }
  if (problems.length === 0 && open.length) problems.push(`unclosed <${open.join('>, <')}>`);
  if (problems.length === 0 && roots === 0) problems.push('no root element');
  return problems;
}
