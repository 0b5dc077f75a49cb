/**
 * Splits one line of a delimited table into trimmed fields, honouring double quotes as RFC
 * 4180 (Shafranovich 2005) describes them: a field that starts (after blanks) with a quote
 * runs to the closing quote and may hold the delimiter; a doubled quote inside stands for one
 * quote. A quote inside an unquoted field is an ordinary character. Quotes do not span lines.
 * Shared by the subjects manifest (study stage) and text recordings (intake stage).
 *
 * @returns at least one field; `['']` for an empty line.
 * @example splitQuotedFields('"a,b", 2 ,"say ""hi"""', ',') // ['a,b', '2', 'say "hi"']
 */
export function splitQuotedFields(line: string, delimiter: string): string[] {
  const fields: string[] = [];
  let field = '';
  let inQuotes = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (inQuotes) {
      if (ch !== '"') field += ch;
      else if (line[i + 1] === '"') field += line[i++];
      else inQuotes = false;
    } else if (ch === '"' && field.trim() === '') {
      field = '';
      inQuotes = true;
    } else if (ch === delimiter) {
      fields.push(field.trim());
      field = '';
    } else {
      field += ch;
    }
  }
  fields.push(field.trim());
  return fields;
}
