import { CATEGORIES } from './__tests__/fixtures';
import { csvSheet, parseCsv, parseSchedule } from './index';

describe('parseCsv (RFC 4180)', () => {
  it('splits fields, honours quotes, doubled quotes, CRLF and line breaks inside quotes', () => {
    expect(parseCsv('a,b,c\r\n1,"two, three","say ""hi"""\r\n"multi\nline",,x\r\n')).toEqual([
      ['a', 'b', 'c'],
      ['1', 'two, three', 'say "hi"'],
      ['multi\nline', '', 'x'],
    ]);
  });
  it('drops a byte-order mark and reads a last line without a line break', () => {
    expect(parseCsv('\ufeffMark,Level\nB1,L2')).toEqual([['Mark', 'Level'], ['B1', 'L2']]);
  });
  it('detects semicolon-separated files (spreadsheets in decimal-comma locales)', () => {
    expect(parseCsv('Mark;Spans [m];Notes\nB1;7.2;"a; b"\n')).toEqual([['Mark', 'Spans [m]', 'Notes'], ['B1', '7.2', 'a; b']]);
  });
});

describe('a CSV schedule', () => {
  it('parses like the workbook: all cells are text', () => {
    const text = [
      'Mark,Level,Category,Material,Spans [m],Supports,E [GPa],I [10^6 mm^4],D [kN/m],L [kN/m],Notes',
      'L2-B1,L2,floor,steel,7.2,pinned,200,186,3.5,6,"typ., see S-201"',
      'L2-B2,L2,floor,steel,6.0+4.5+6.0,,200,"1,240",3.5,6,',
      '',
    ].join('\r\n');
    const { members, problems } = parseSchedule({ unitSystem: 'SI', categories: CATEGORIES, members: csvSheet(text) });
    expect(problems).toEqual([]);
    expect(members.map((m) => [m.mark, m.spans, m.I, m.notes])).toEqual([
      ['L2-B1', [7.2], expect.closeTo(186e-6, 18), 'typ., see S-201'],
      ['L2-B2', [6, 4.5, 6], expect.closeTo(1240e-6, 18), null],
    ]);
  });
});
