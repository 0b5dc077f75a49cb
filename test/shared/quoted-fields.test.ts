import { describe, expect, it } from 'vitest';
import { splitQuotedFields } from '../../src/shared/quoted-fields.ts';

describe('splitQuotedFields (RFC 4180, Shafranovich 2005, section 2 rules 5-7 [M])', () => {
  it('a quoted field may hold the delimiter and doubled quotes', () => {
    expect(splitQuotedFields('"a,b", 2 ,"say ""hi"""', ',')).toEqual(['a,b', '2', 'say "hi"']);
    expect(splitQuotedFields('"x;y";z', ';')).toEqual(['x;y', 'z']);
  });

  it('a quote inside an unquoted field is an ordinary character; fields are trimmed', () => {
    expect(splitQuotedFields('ab"c, d', ',')).toEqual(['ab"c', 'd']);
    expect(splitQuotedFields('  "q" ,r', ',')).toEqual(['q', 'r']);
  });

  it('an empty line is one empty field, and a trailing delimiter an empty last field', () => {
    expect(splitQuotedFields('', ',')).toEqual(['']);
    expect(splitQuotedFields('a,', ',')).toEqual(['a', '']);
  });
});
