import { describe, expect, it } from 'vitest';
import { insertMention, matchMembers, mentionHandle, mentionQueryAt, parseMentions, resolveMentions } from './mentions';

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

describe('mentionQueryAt', () => {
  it('finds the @ the caret is after, at the start or after a space or bracket', () => {
    expect(mentionQueryAt('@', 1)).toEqual({ start: 0, end: 1, query: '' });
    expect(mentionQueryAt('cc @an', 6)).toEqual({ start: 3, end: 6, query: 'an' });
    expect(mentionQueryAt('(@Ana', 5)).toEqual({ start: 1, end: 5, query: 'Ana' });
    expect(mentionQueryAt('cc @ana@lab.ex', 14)).toEqual({ start: 3, end: 14, query: 'ana@lab.ex' });
  });
  it('covers the rest of the word after the caret, so picking replaces all of it', () => {
    expect(mentionQueryAt('cc @anxx please', 6)).toEqual({ start: 3, end: 8, query: 'an' });
  });
  it('is nothing inside an e-mail address, after a space, or with the caret before the @', () => {
    expect(mentionQueryAt('write to ana@lab', 16)).toBeNull();
    expect(mentionQueryAt('@ana and', 8)).toBeNull();
    expect(mentionQueryAt('cc @ana', 3)).toBeNull();
    expect(mentionQueryAt('cc @@ana', 8)).toBeNull();
    expect(mentionQueryAt('plain text', 5)).toBeNull();
    expect(mentionQueryAt('x', 5)).toBeNull();
  });
});

describe('matchMembers', () => {
  const people = [
    { id: '1', name: 'Ana Ruiz', email: 'ana.ruiz@lab.example' },
    { id: '2', name: 'Ben Okafor', email: 'ben@lab.example' },
    { id: '3', name: 'Dana Bell', email: 'dbell@lab.example' },
    { id: '4', name: null, email: 'zed@lab.example' },
  ];
  it('everyone for an empty query, by name', () => {
    expect(matchMembers('', people).map((m) => m.id)).toEqual(['1', '2', '3', '4']);
  });
  it('address start first, then a name word, then anywhere; case does not matter', () => {
    expect(matchMembers('AN', people).map((m) => m.id)).toEqual(['1', '3']);
    expect(matchMembers('bel', people).map((m) => m.id)).toEqual(['3']);
    expect(matchMembers('b', people).map((m) => m.id)).toEqual(['2', '3']);
    expect(matchMembers('okafor', people).map((m) => m.id)).toEqual(['2']);
    expect(matchMembers('ben@lab', people).map((m) => m.id)).toEqual(['2']);
    // The shared domain does not match everyone.
    expect(matchMembers('lab.example', people)).toEqual([]);
  });
  it('nothing when nothing matches; at most `limit`', () => {
    expect(matchMembers('xyz', people)).toEqual([]);
    expect(matchMembers('', people, 2)).toHaveLength(2);
  });
});

describe('mentionHandle', () => {
  const members = [
    { id: '1', email: 'Ana.Ruiz@lab.example' },
    { id: '2', email: 'ben@lab.example' },
    { id: '3', email: 'ben@other.example' },
    { id: '4', email: "o'neil@lab.example" },
  ];
  it('the local part when it is unique, else the full address; the server reads it back as that member', () => {
    expect(mentionHandle(members[0]!, members)).toBe('ana.ruiz');
    expect(mentionHandle(members[1]!, members)).toBe('ben@lab.example');
    expect(mentionHandle(members[2]!, members)).toBe('ben@other.example');
    for (const m of members.slice(0, 3)) {
      expect(resolveMentions(parseMentions(`Look here, @${mentionHandle(m, members)}.`), members)).toEqual([m.id]);
    }
  });
  it('null for an address the mention syntax cannot carry', () => {
    expect(mentionHandle(members[3]!, members)).toBeNull();
  });
});

describe('insertMention', () => {
  it('replaces the typed word with @handle and a space, caret after it', () => {
    const text = 'cc @an';
    const r = insertMention(text, mentionQueryAt(text, 6)!, 'ana.ruiz');
    expect(r).toEqual({ text: 'cc @ana.ruiz ', caret: 13 });
  });
  it('in the middle of the text: no second space, caret past the existing one', () => {
    const text = 'cc @anxx please';
    const r = insertMention(text, mentionQueryAt(text, 6)!, 'ana.ruiz');
    expect(r.text).toBe('cc @ana.ruiz please');
    expect(r.text.slice(0, r.caret)).toBe('cc @ana.ruiz ');
  });
});
