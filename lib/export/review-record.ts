/**
 * The printable review record of an approved spectrum: one self-contained HTML page (inline
 * styles, the plot as an inline data image, no scripts, nothing fetched) that prints cleanly on
 * A4 or Letter. Every value that came from a person or a file is escaped.
 */
import { esc, escLines } from './html';

export interface RecordPerson {
  name: string | null;
  email: string;
}

export interface ReviewRecordData {
  generatedAt: Date;
  link: string;
  group: { name: string; slug: string };
  spectrum: {
    id: string;
    title: string;
    material: string;
    formula: string | null;
    method: string | null;
    code: string | null;
    supercell: string | null;
    qmesh: string | null;
    notes: string | null;
    status: string;
    submitter: RecordPerson | null;
    reviewers: RecordPerson[];
    createdAt: Date;
  };
  revision: { number: number; originalName: string; verdict: string | null; screenedAt: Date | null; qpoints: number | null; branches: number | null };
  findings: {
    check: string;
    severity: string;
    message: string;
    index: number | null;
    branch: number | null;
    waiver: { reason: string; author: RecordPerson | null; at: Date } | null;
  }[];
  threads: {
    anchor: string;
    revisionNumber: number;
    author: RecordPerson | null;
    body: string;
    blocking: boolean;
    resolved: boolean;
    createdAt: Date;
    replies: { author: RecordPerson | null; body: string; at: Date }[];
  }[];
  decisions: { verdict: string; reviewer: RecordPerson | null; revisionNumber: number; note: string; at: Date; counts: boolean }[];
  revisions: { number: number; originalName: string; uploader: RecordPerson | null; at: Date; verdict: string | null; fail: number; warn: number; info: number; note: string | null }[];
  /** Null when the reader's role may not see the audit trail. */
  audit: { at: Date; actor: RecordPerson | null; action: string; target: string | null; data: Record<string, unknown> }[] | null;
  /** The plot as SVG markup (embedded as an image, so nothing in it can run). */
  plotSvg: string | null;
}

export const SCREENING_CAUTION =
  'Screening is an aid, not a verdict on the physics. A flagged imaginary mode may be a real instability — ' +
  'a soft mode or a sign of a phase transition — that the reviewers chose to keep. Read the findings together ' +
  'with the waivers, the threads and the decisions below.';

const when = (d: Date | null) => (d ? `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC` : '—');
const who = (p: RecordPerson | null) => (p ? esc(p.name ? `${p.name} <${p.email}>` : p.email) : '<span class="muted">a former member</span>');
const dash = (v: string | number | null | undefined) => (v === null || v === undefined || v === '' ? '—' : esc(v));

const verdictText: Record<string, string> = { approve: 'Approved', return: 'Returned for fixes', reject: 'Rejected' };
const severityText: Record<string, string> = { fail: 'FAIL', warn: 'WARN', info: 'INFO' };

function table(head: string[], rows: string[][], empty: string): string {
  if (!rows.length) return `<p class="muted">${esc(empty)}</p>`;
  return `<table><thead><tr>${head.map((h) => `<th>${esc(h)}</th>`).join('')}</tr></thead><tbody>${rows
    .map((r) => `<tr>${r.map((c) => `<td>${c}</td>`).join('')}</tr>`)
    .join('')}</tbody></table>`;
}

function auditData(data: Record<string, unknown>): string {
  const parts = Object.entries(data)
    .filter(([, v]) => v !== null && v !== undefined && v !== '')
    .map(([k, v]) => `${k}: ${typeof v === 'string' ? v : JSON.stringify(v)}`);
  const text = parts.join('; ');
  return esc(text.length > 300 ? `${text.slice(0, 299)}…` : text);
}

const styles = `
@page { size: A4; margin: 16mm 14mm; }
* { box-sizing: border-box; }
body { font: 10.5pt/1.45 "Helvetica Neue", Arial, sans-serif; color: #1d2321; margin: 0 auto; max-width: 190mm; padding: 12mm 0; }
h1 { font-size: 18pt; margin: 0 0 2mm; }
h2 { font-size: 12.5pt; margin: 8mm 0 2mm; border-bottom: 1px solid #9ab0aa; padding-bottom: 1mm; break-after: avoid; page-break-after: avoid; }
h3 { font-size: 10.5pt; margin: 4mm 0 1mm; break-after: avoid; }
p { margin: 0 0 2mm; }
table { width: 100%; border-collapse: collapse; margin: 1mm 0 3mm; font-size: 9.5pt; }
thead { display: table-header-group; }
tr { break-inside: avoid; page-break-inside: avoid; }
th, td { text-align: left; vertical-align: top; border: 1px solid #c9d3d0; padding: 1.2mm 1.8mm; }
th { background: #eef2f1; font-weight: 600; }
dl { display: grid; grid-template-columns: 34mm 1fr; gap: 1mm 4mm; margin: 0 0 3mm; }
dt { font-weight: 600; } dd { margin: 0; }
.muted { color: #5f6b67; }
.caution { border: 1.5px solid #b0413e; padding: 3mm 4mm; margin: 4mm 0; break-inside: avoid; }
.caution strong { display: block; margin-bottom: 1mm; }
.thread { border: 1px solid #c9d3d0; padding: 2mm 3mm; margin: 0 0 3mm; break-inside: avoid; }
.reply { border-left: 2px solid #9ab0aa; padding-left: 3mm; margin: 2mm 0 0; }
.tag { display: inline-block; border: 1px solid #5f6b67; border-radius: 2px; padding: 0 1.5mm; font-size: 8.5pt; margin-right: 1mm; }
.plot { width: 100%; height: auto; border: 1px solid #c9d3d0; }
.waived { text-decoration: none; }
footer { margin-top: 8mm; font-size: 8.5pt; color: #5f6b67; }
@media screen { body { padding: 12mm 6mm; } }
`;

export function reviewRecordHtml(r: ReviewRecordData): string {
  const s = r.spectrum;
  const meta: [string, string][] = [
    ['Material', esc(s.material)],
    ['Formula', dash(s.formula)],
    ['Method', dash(s.method)],
    ['Code', dash(s.code)],
    ['Supercell', dash(s.supercell)],
    ['q-mesh', dash(s.qmesh)],
    ['Group', esc(r.group.name)],
    ['Status', esc(s.status)],
    ['Submitter', who(s.submitter)],
    ['Reviewers', s.reviewers.length ? s.reviewers.map(who).join(', ') : '—'],
    ['Revision', `${esc(r.revision.number)} — ${esc(r.revision.originalName)}`],
    ['Screening verdict', dash(r.revision.verdict)],
    ['Screened', esc(when(r.revision.screenedAt))],
    ['Size', r.revision.qpoints !== null ? `${esc(r.revision.qpoints)} q-points × ${esc(r.revision.branches)} branches` : '—'],
    ['Submitted', esc(when(s.createdAt))],
    ['Spectrum id', esc(s.id)],
  ];
  if (s.notes) meta.push(['Notes', escLines(s.notes)]);

  const findings = table(
    ['Severity', 'Check', 'Where', 'Message', 'Waiver'],
    r.findings.map((f) => [
      `<span class="tag">${esc(severityText[f.severity] ?? f.severity)}</span>`,
      esc(f.check),
      f.index !== null ? `q-point ${esc(f.index)}${f.branch !== null ? `, branch ${esc(f.branch)}` : ''}` : '—',
      esc(f.message),
      f.waiver ? `<strong>Waived</strong> by ${who(f.waiver.author)}, ${esc(when(f.waiver.at))}:<br>${escLines(f.waiver.reason)}` : '<span class="muted">not waived</span>',
    ]),
    'Screening found nothing to report on this revision.',
  );

  const threads = r.threads.length
    ? r.threads
        .map(
          (t) =>
            `<div class="thread"><h3>${esc(t.anchor)} <span class="muted">(opened on revision ${esc(t.revisionNumber)})</span></h3>` +
            `<p>${t.blocking ? '<span class="tag">blocking</span>' : ''}<span class="tag">${t.resolved ? 'resolved' : 'open'}</span> ${who(t.author)}, ${esc(when(t.createdAt))}</p>` +
            `<p>${escLines(t.body)}</p>` +
            t.replies.map((rep) => `<div class="reply"><p class="muted">${who(rep.author)}, ${esc(when(rep.at))}</p><p>${escLines(rep.body)}</p></div>`).join('') +
            '</div>',
        )
        .join('')
    : '<p class="muted">No threads were opened.</p>';

  const decisions = table(
    ['When', 'Reviewer', 'Revision', 'Decision', 'Note'],
    r.decisions.map((d) => [
      esc(when(d.at)),
      who(d.reviewer),
      esc(d.revisionNumber),
      `${esc(verdictText[d.verdict] ?? d.verdict)}${d.verdict === 'approve' && !d.counts ? ' <span class="muted">(no longer counts)</span>' : ''}`,
      escLines(d.note),
    ]),
    'No decisions.',
  );

  const revisions = table(
    ['Revision', 'File', 'Uploaded by', 'When', 'Verdict', 'Findings (fail / warn / info)', 'Note'],
    r.revisions.map((v) => [esc(v.number), esc(v.originalName), who(v.uploader), esc(when(v.at)), dash(v.verdict), `${esc(v.fail)} / ${esc(v.warn)} / ${esc(v.info)}`, v.note ? escLines(v.note) : '—']),
    'No revisions.',
  );

  const audit =
    r.audit === null
      ? '<p class="muted">The audit trail is included when an admin of the group exports this record.</p>'
      : table(
          ['When', 'Who', 'Action', 'Target', 'Details'],
          r.audit.map((a) => [esc(when(a.at)), a.actor ? who(a.actor) : '<span class="muted">Branchwise</span>', esc(a.action), dash(a.target), auditData(a.data)]),
          'Nothing was recorded.',
        );

  const plot = r.plotSvg
    ? `<img class="plot" alt="Dispersion of ${esc(s.title)}, revision ${esc(r.revision.number)}" src="data:image/svg+xml;base64,${Buffer.from(r.plotSvg, 'utf8').toString('base64')}">`
    : '';

  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Review record — ${esc(s.title)} (revision ${esc(r.revision.number)})</title>
<style>${styles}</style></head>
<body>
<header><p class="muted">Branchwise review record · ${esc(r.group.name)}</p><h1>${esc(s.title)}</h1>
<p>Approved spectrum, revision ${esc(r.revision.number)}. Generated ${esc(when(r.generatedAt))} from <span class="muted">${esc(r.link)}</span></p></header>
<div class="caution" role="note"><strong>About screening</strong>${esc(SCREENING_CAUTION)}</div>
<h2>Spectrum</h2><dl>${meta.map(([k, v]) => `<dt>${esc(k)}</dt><dd>${v}</dd>`).join('')}</dl>
${plot ? `<h2>Dispersion</h2>${plot}` : ''}
<h2>Screening findings and waivers</h2>${findings}
<h2>Threads</h2>${threads}
<h2>Decisions</h2>${decisions}
<h2>Revision history</h2>${revisions}
<h2>Audit trail</h2>${audit}
<footer>Printed from Branchwise. Times are UTC. This record lists what the reviewers saw and decided; it does not certify the calculation.</footer>
</body></html>
`;
}
