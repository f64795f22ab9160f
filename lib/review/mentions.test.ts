import { describe, expect, it } from 'vitest';
import { parseMentions, resolveMentions } from './mentions';

describe('parseMentions', () => {
  it('finds handles and full addresses, once each, lower-cased', () => {
    expect(parseMentions('@Ana.Ruiz see this; cc @ben@lab.example and @ana.ruiz again.')).toEqual(['ana.ruiz', 'ben@lab.example']);
  });
  it('an e-mail address in the text is not a mention', () => {
    expect(parseMentions('write to ana@lab.example')).toEqual([]);
  });
  it('sentence punctuation is not part of the handle', () => {
    expect(parseMentions('(@kim), @lee. @moe!')).toEqual(['kim', 'lee', 'moe']);
  });
  it('a bare @ is nothing', () => {
    expect(parseMentions('a @ b')).toEqual([]);
  });
});

describe('resolveMentions', () => {
  const members = [
    { id: '1', email: 'ana.ruiz@lab.example' },
    { id: '2', email: 'ben@lab.example' },
    { id: '3', email: 'ben@other.example' },
  ];
  it('matches full addresses and unique local parts', () => {
    expect(resolveMentions(['ana.ruiz', 'ben@other.example'], members)).toEqual(['1', '3']);
  });
  it('an ambiguous or unknown handle names nobody', () => {
    expect(resolveMentions(['ben', 'zed'], members)).toEqual([]);
  });
});
