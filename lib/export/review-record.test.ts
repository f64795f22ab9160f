import { describe, expect, it } from 'vitest';
import { reviewRecordHtml, SCREENING_CAUTION, type ReviewRecordData } from './review-record';

const at = new Date('2026-03-04T05:06:00Z');
const ana = { name: 'Ana <script>alert(1)</script>', email: 'ana@lab.test' };
const record: ReviewRecordData = {
  generatedAt: at,
  link: 'http://127.0.0.1:3100/groups/lab/spectra/s1',
  group: { name: 'Invented Lab', slug: 'lab' },
  spectrum: {
    id: 's1', title: 'Rock-salt "A" & <b>B</b>', material: 'Invented solid', formula: null, method: 'DFPT', code: 'code 1.0',
    supercell: '4x4x4', qmesh: null, notes: 'line one\nline two', status: 'approved', submitter: ana, reviewers: [{ name: null, email: 'rev@lab.test' }], createdAt: at,
  },
  revision: { number: 2, originalName: 'a.dat', verdict: 'warn', screenedAt: at, qpoints: 40, branches: 6 },
  findings: [
    { check: 'imaginary-modes', severity: 'fail', message: 'branch 1 below zero', index: 3, branch: 0, waiver: { reason: 'Soft mode <kept>', author: ana, at } },
    { check: 'continuity', severity: 'warn', message: 'jump', index: null, branch: null, waiver: null },
  ],
  threads: [{ anchor: 'q-point 3, branch 1 (2.5000 THz)', revisionNumber: 1, author: ana, body: 'Is <this> real?', blocking: true, resolved: true, createdAt: at, replies: [{ author: null, body: 'Yes & kept.', at }] }],
  decisions: [{ verdict: 'approve', reviewer: { name: 'Rev', email: 'rev@lab.test' }, revisionNumber: 2, note: 'Fine <ok>', at, counts: true }],
  revisions: [{ number: 1, originalName: 'first<.dat', uploader: ana, at, verdict: 'fail', fail: 1, warn: 0, info: 0, note: null }],
  audit: [{ at, actor: ana, action: 'decision.made', target: 'spectrum:s1', data: { verdict: 'approve', note: '<i>x</i>' } }],
  plotSvg: '<svg xmlns="http://www.w3.org/2000/svg"><text>Γ</text></svg>',
};

describe('review record', () => {
  const html = reviewRecordHtml(record);

  it('escapes everything that came from people or files', () => {
    expect(html).not.toContain('<script>');
    expect(html).not.toContain('<b>B</b>');
    expect(html).not.toContain('<this>');
    expect(html).not.toContain('<i>x</i>');
    expect(html).toContain('Rock-salt &quot;A&quot; &amp; &lt;b&gt;B&lt;/b&gt;');
    expect(html).toContain('Ana &lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('line one<br>line two');
  });

  it('holds the caution, findings with waivers, threads, decisions, revisions and audit', () => {
    expect(html).toContain(SCREENING_CAUTION.replace(/'/g, '&#39;'));
    expect(html).toContain('Soft mode &lt;kept&gt;');
    expect(html).toContain('not waived');
    expect(html).toContain('Is &lt;this&gt; real?');
    expect(html).toContain('Yes &amp; kept.');
    expect(html).toContain('blocking');
    expect(html).toContain('Fine &lt;ok&gt;');
    expect(html).toContain('first&lt;.dat');
    expect(html).toContain('decision.made');
    expect(html).toContain('2026-03-04 05:06 UTC');
  });

  it('is self-contained and printable: no scripts or outside resources, print page rules, the plot inline', () => {
    expect(html).toMatch(/@page \{ size: A4/);
    expect(html).not.toMatch(/<script|<link|src="http/);
    expect(html).toContain('src="data:image/svg+xml;base64,');
    expect(html).toContain("default-src 'none'");
  });

  it('names a finding place with the 0-based q-point and branch the workspace shows', () => {
    expect(html).toContain('q-point 3, branch 0');
    expect(html).not.toMatch(/point 3, branch 1</);
  });

  it('says when the audit trail is left out for the reader', () => {
    expect(reviewRecordHtml({ ...record, audit: null })).toContain('included when an admin of the group exports');
  });
});
