/** Scanning a text line by line and token by token in place (shared/import/LineTokens.ts). */
import { expect, test } from 'vitest';
import { LineTokens } from '../../shared/import/LineTokens';

function scan(text: string): [number, string[]][] {
  const tokens = new LineTokens(text);
  const out: [number, string[]][] = [];
  while (tokens.nextLine()) {
    const line: string[] = [];
    while (tokens.next()) line.push(tokens.token());
    out.push([tokens.line, line]);
  }
  return out;
}

test('LineTokens splits lines on LF and CRLF and tokens on spaces and tabs', () => {
  expect(scan('a b\r\n\tc  d\n\ne')).toEqual([
    [1, ['a', 'b']],
    [2, ['c', 'd']],
    [3, []],
    [4, ['e']],
  ]);
});

test('LineTokens splits on CR alone when the text has no LF (classic Mac OS)', () => {
  expect(scan('v 0 0 0\rv 1 0 0\r')).toEqual([
    [1, ['v', '0', '0', '0']],
    [2, ['v', '1', '0', '0']],
  ]);
});

test('LineTokens drops comments from # to the end of the line', () => {
  expect(scan('# all comment\nv 1 2#three\nf 1 # 2\n')).toEqual([
    [1, []],
    [2, ['v', '1', '2']],
    [3, ['f', '1']],
  ]);
});

test('LineTokens skips a byte order mark and gives no line after a final newline', () => {
  expect(scan('\uFEFFOFF\n')).toEqual([[1, ['OFF']]]);
  expect(scan('')).toEqual([[1, []]]);
});

test('LineTokens.is compares the current token without allocating', () => {
  const tokens = new LineTokens('OFF BINARY');
  tokens.nextLine();
  tokens.next();
  expect([tokens.is('OFF'), tokens.is('OF'), tokens.is('OFFS')]).toEqual([true, false, false]);
});
