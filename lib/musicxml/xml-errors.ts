// A malformed or cut-off file explained by line and what was expected there, in words for the person
// uploading rather than the XML parser's own.
import { XMLValidator } from "fast-xml-parser";
import { MusicXmlError } from "./xml";

interface ValidationError {
  code: string;
  msg: string;
  line: number;
  col: number;
}

function explain(e: ValidationError, lastLine: number): string {
  const at = `Line ${e.line}, column ${e.col}`;
  const closing = /^Expected closing tag '([^']+)' \(opened in line (\d+), col \d+\) instead of closing tag '([^']+)'/.exec(e.msg);
  if (closing) return `${at}: expected the closing tag </${closing[1]}> (opened on line ${closing[2]}), but found </${closing[3]}>.`;
  const unclosed = /^Invalid '\[(.*)\]' found/s.exec(e.msg);
  if (unclosed) {
    const tags = [...unclosed[1]!.matchAll(/"([^"]+)"/g)].map((m) => `<${m[1]}>`).reverse();
    return `The file ends at line ${lastLine} before the score is complete: expected ${tags.map((t) => t.replace("<", "</")).join(", ")} to close ${tags.length === 1 ? "it" : "them"}. It may have been cut off while saving or uploading.`;
  }
  if (e.line >= lastLine) return `The file ends at line ${lastLine} in the middle of a tag, before the score is complete. It may have been cut off while saving or uploading.`;
  const attr = /^Attribute '([^']+)' is without value/.exec(e.msg);
  if (attr) return `${at}: expected a value in quotes for the attribute ${attr[1]} (like ${attr[1]}="1").`;
  const quotes = /^Attribute '([^']+)' (?:is|has) .*/.exec(e.msg);
  if (quotes) return `${at}: the attribute ${quotes[1]} is not written the XML way (name="value", each name once).`;
  if (/char '&' is not expected/.test(e.msg)) return `${at}: a bare "&" — expected &amp; (or another entity like &lt;).`;
  if (/Closing tag '([^']+)' doesn't have proper opening tag/.test(e.msg)) return `${at}: a closing tag with no opening tag before it.`;
  if (/Multiple possible root nodes|Extra text at the end/.test(e.msg)) return `${at}: expected the end of the file after the closing </score-partwise>.`;
  if (e.code === "InvalidTag") return `${at}: expected a tag name after "<" (a tag is written like <measure>).`;
  return `${at}: this is not how XML is written here.`;
}

/** Throws a MusicXmlError naming the line when `text` is not well-formed XML. */
export function assertWellFormed(text: string): void {
  const result = XMLValidator.validate(text, { allowBooleanAttributes: false });
  if (result === true) return;
  const lastLine = text.replace(/\s+$/, "").split("\n").length;
  throw new MusicXmlError("not_xml", `This file is not well-formed XML. ${explain(result.err as ValidationError, lastLine)}`);
}
