/**
 * A minimal RFC 4180 CSV parser for tests (fields separated by commas, records by CRLF or LF,
 * quoted fields may hold commas, line breaks and doubled quotes). Written independently of
 * src/report/toCsv.ts so a round trip checks the writer against the RFC's grammar.
 */
export function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let field = "";
  let quoted = false;
  let index = 0;
  while (index < text.length) {
    const character = text[index]!;
    if (quoted) {
      if (character === '"' && text[index + 1] === '"') {
        field += '"';
        index += 2;
        continue;
      }
      if (character === '"') quoted = false;
      else field += character;
      index += 1;
      continue;
    }
    if (character === '"' && field === "") quoted = true;
    else if (character === ",") {
      record.push(field);
      field = "";
    } else if (character === "\r" && text[index + 1] === "\n") {
      record.push(field);
      records.push(record);
      record = [];
      field = "";
      index += 1;
    } else if (character === "\n") {
      record.push(field);
      records.push(record);
      record = [];
      field = "";
    } else field += character;
    index += 1;
  }
  if (field !== "" || record.length > 0) {
    record.push(field);
    records.push(record);
  }
  return records;
}
