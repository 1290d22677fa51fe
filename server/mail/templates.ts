/**
 * The messages Kenning sends, as pure functions: input → `{ subject, text, html }`.
 * The caller adds the recipients and hands the result to the mailer.
 *
 * Each message is written once as a list of blocks and rendered twice, so the plain-text
 * and HTML versions always say the same thing. Every value is escaped in the HTML; links
 * must be absolute http(s) URLs.
 */

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

/** A template was given an unusable value: a link that is not an absolute http(s) URL, or an unknown decision. */
export class MailTemplateError extends Error {
  override name = 'MailTemplateError';
}

/** The closing line of every message. */
export const ESTIMATES_NOTE = "Kenning's figures are planning estimates; your agency's own procedures apply.";

type Block =
  | { kind: 'paragraph'; text: string }
  | { kind: 'link'; label: string; url: string }
  | { kind: 'quote'; text: string }
  | { kind: 'facts'; rows: Array<[label: string, value: string]> };

const paragraph = (text: string): Block => ({ kind: 'paragraph', text });

/** Escapes the five characters that matter in HTML text and attribute values. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** Collapses line breaks and runs of white space, so a value cannot break a subject or a sentence. */
const oneLine = (value: string) => value.replace(/\s+/g, ' ').trim();

/** An absolute http(s) URL, normalised; anything else (javascript:, relative, junk) throws. */
function checkedUrl(value: string, field: string): string {
  let url: URL;
  try {
    url = new URL(value.trim());
  } catch {
    throw new MailTemplateError(`${field} must be an absolute URL; got ${JSON.stringify(value)}.`);
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') {
    throw new MailTemplateError(`${field} must be an http(s) URL; got ${JSON.stringify(url.protocol)}.`);
  }
  return url.href;
}

function renderText(blocks: Block[]): string {
  const parts = blocks.map((b) => {
    switch (b.kind) {
      case 'paragraph':
        return b.text;
      case 'link':
        return b.url;
      case 'quote':
        return b.text
          .split(/\r\n|\r|\n/)
          .map((line) => `> ${line}`.trimEnd())
          .join('\n');
      case 'facts':
        return b.rows.map(([label, value]) => `${label}: ${value}`).join('\n');
    }
  });
  return [...parts, '--', ESTIMATES_NOTE].join('\n\n') + '\n';
}

const P = 'margin:0 0 16px';
const MUTED = 'color:#52606d;font-size:13px';

function renderHtml(subject: string, blocks: Block[]): string {
  const body = blocks.map((b) => {
    switch (b.kind) {
      case 'paragraph':
        return `<p style="${P}">${escapeHtml(b.text)}</p>`;
      case 'link':
        return (
          `<p style="${P}"><a href="${escapeHtml(b.url)}" style="color:#1d4ed8;font-weight:bold">${escapeHtml(b.label)}</a>` +
          `<br><span style="${MUTED};word-break:break-all">${escapeHtml(b.url)}</span></p>`
        );
      case 'quote':
        return `<blockquote style="${P};padding:8px 12px;border-left:3px solid #9aa5b1;white-space:pre-wrap">${escapeHtml(b.text)}</blockquote>`;
      case 'facts':
        return (
          `<table style="${P};border-collapse:collapse">` +
          b.rows
            .map(
              ([label, value]) =>
                `<tr><th scope="row" style="text-align:left;padding:2px 16px 2px 0;font-weight:normal;color:#52606d">${escapeHtml(label)}</th>` +
                `<td style="padding:2px 0">${escapeHtml(value)}</td></tr>`,
            )
            .join('') +
          '</table>'
        );
    }
  });
  return [
    '<!doctype html>',
    '<html lang="en">',
    `<head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>`,
    '<body style="margin:0;padding:24px;background:#ffffff;color:#1f2933;font-family:Arial,Helvetica,sans-serif;font-size:15px;line-height:1.5">',
    '<div style="max-width:560px">',
    ...body,
    `<p style="margin:32px 0 0;padding-top:12px;border-top:1px solid #d9e2ec;${MUTED}">${escapeHtml(ESTIMATES_NOTE)}</p>`,
    '</div>',
    '</body>',
    '</html>',
    '',
  ].join('\n');
}

function compose(subject: string, blocks: Block[]): MailContent {
  const s = oneLine(subject);
  return { subject: s, text: renderText(blocks), html: renderHtml(s, blocks) };
}

export interface InvitationInput {
  /** The invited person's name. */
  name: string;
  organizationName: string;
  /** The one-time set-password link (absolute http(s) URL). */
  setPasswordUrl: string;
  /** Name of the administrator who sent the invitation. */
  invitedBy: string;
}

/**
 * An invitation to a new account, with its set-password link.
 *
 * @example
 * invitation({ name: 'Ada Fenwick', organizationName: 'Harrowmere Lookout Service', invitedBy: 'Rowan Tull',
 *   setPasswordUrl: 'https://kenning.example/set-password?token=abc' }).subject
 * // 'Set up your Kenning account for Harrowmere Lookout Service'
 */
export function invitation(input: InvitationInput): MailContent {
  const name = oneLine(input.name);
  const org = oneLine(input.organizationName);
  const invitedBy = oneLine(input.invitedBy);
  const url = checkedUrl(input.setPasswordUrl, 'setPasswordUrl');
  return compose(`Set up your Kenning account for ${org}`, [
    paragraph(name ? `Hello ${name},` : 'Hello,'),
    paragraph(`${invitedBy} has given you an account for ${org} in Kenning. To start using it, choose a password:`),
    { kind: 'link', label: 'Choose a password', url },
    paragraph(
      `The link works once and for a limited time. If it no longer works, ask ${invitedBy} or another administrator of ${org} for a new invitation.`,
    ),
    paragraph('If you were not expecting this, you can ignore it: the account stays unusable until a password is chosen.'),
  ]);
}

export interface PlanSubmittedInput {
  planTitle: string;
  siteName: string;
  /** The plan's version number as shown in Kenning. */
  version: number;
  /** Name of the planner who submitted it. */
  preparedBy: string;
  /** Where the reviewer opens the plan (absolute http(s) URL). */
  reviewUrl: string;
}

/**
 * Tells a reviewer that a plan is waiting for them.
 *
 * @example
 * planSubmitted({ planTitle: 'Ridge line cover', siteName: 'Cold Fell', version: 3, preparedBy: 'Ada Fenwick',
 *   reviewUrl: 'https://kenning.example/plans/1' }).subject
 * // 'For review: Ridge line cover (version 3)'
 */
export function planSubmitted(input: PlanSubmittedInput): MailContent {
  const title = oneLine(input.planTitle);
  const preparedBy = oneLine(input.preparedBy);
  const version = String(input.version);
  const url = checkedUrl(input.reviewUrl, 'reviewUrl');
  return compose(`For review: ${title} (version ${version})`, [
    paragraph(`${preparedBy} has submitted a plan for review.`),
    {
      kind: 'facts',
      rows: [
        ['Plan', title],
        ['Site', oneLine(input.siteName)],
        ['Version', version],
        ['Prepared by', preparedBy],
      ],
    },
    paragraph('Open it to approve it, or to return it to the planner with your comments:'),
    { kind: 'link', label: 'Review the plan', url },
    paragraph('You receive this because you review plans for your organisation in Kenning.'),
  ]);
}

export type ReviewDecision = 'approved' | 'returned';

export interface ReviewDecidedInput {
  planTitle: string;
  decision: ReviewDecision;
  /** Name of the reviewer who decided. */
  reviewer: string;
  /** The reviewer's comment; empty or missing when they left none. */
  comment?: string | null;
  /** Where the planner opens the plan (absolute http(s) URL). */
  planUrl: string;
}

/**
 * Tells the planner what the reviewer decided, with the reviewer's comment quoted.
 *
 * @example
 * reviewDecided({ planTitle: 'Ridge line cover', decision: 'returned', reviewer: 'Rowan Tull',
 *   comment: 'Add the north slope.', planUrl: 'https://kenning.example/plans/1' }).subject
 * // 'Returned for changes: Ridge line cover'
 */
export function reviewDecided(input: ReviewDecidedInput): MailContent {
  const title = oneLine(input.planTitle);
  const reviewer = oneLine(input.reviewer);
  const comment = (input.comment ?? '').trim();
  const url = checkedUrl(input.planUrl, 'planUrl');
  const said: Block[] = comment ? [paragraph(`${reviewer} wrote:`), { kind: 'quote', text: comment }] : [];

  if (input.decision === 'approved') {
    return compose(`Approved: ${title}`, [
      paragraph(`${reviewer} has approved your plan “${title}”.`),
      ...said,
      paragraph('You can open the plan here:'),
      { kind: 'link', label: 'Open the plan', url },
    ]);
  }
  if (input.decision !== 'returned') {
    throw new MailTemplateError(`decision must be 'approved' or 'returned'; got ${JSON.stringify(input.decision)}.`);
  }
  return compose(`Returned for changes: ${title}`, [
    paragraph(`${reviewer} has returned your plan “${title}” for changes.`),
    ...(said.length ? said : [paragraph(`${reviewer} left no comment, so ask them what needs to change.`)]),
    paragraph('Make the changes, then submit the plan again:'),
    { kind: 'link', label: 'Open the plan', url },
  ]);
}

export interface FixReportedInput {
  incidentTitle: string;
  siteName: string;
  /** The fix's position in words, e.g. `51.70123° N 15.30456° E (WGS 84) · MGRS 33U WT 12345 67890`. */
  position: string;
  /** The error area in words, e.g. `0.42 km² (error quadrilateral, ±1σ)`. */
  errorArea: string;
  /** Posts and their bearings, one line each. */
  bearings: string[];
  /** The fix's warnings (narrow cut angle, a bearing that disagrees …). */
  warnings: string[];
  /** Where the incident opens (absolute http(s) URL). */
  incidentUrl: string;
}

/**
 * Tells the duty planners that an incident has a new fix, with its position
 * and error area.
 *
 * @example
 * fixReported({ incidentTitle: 'Smoke north of Hobb Ridge', siteName: 'Wenlow Forest District',
 *   position: '51.70000° N 15.30000° E (WGS 84)', errorArea: '0.42 km²', bearings: [], warnings: [],
 *   incidentUrl: 'https://kenning.example/incidents/1' }).subject
 * // 'New fix: Smoke north of Hobb Ridge (Wenlow Forest District)'
 */
export function fixReported(input: FixReportedInput): MailContent {
  const title = oneLine(input.incidentTitle);
  const site = oneLine(input.siteName);
  const url = checkedUrl(input.incidentUrl, 'incidentUrl');
  return compose(`New fix: ${title} (${site})`, [
    paragraph(`Bearings from ${input.bearings.length} posts now cross for “${title}”.`),
    {
      kind: 'facts',
      rows: [
        ['Position', oneLine(input.position)],
        ['Error area', oneLine(input.errorArea)],
        ...input.bearings.map((b, i): [string, string] => [`Bearing ${i + 1}`, oneLine(b)]),
      ],
    },
    ...input.warnings.map((w) => paragraph(`Note: ${oneLine(w)}`)),
    paragraph(ESTIMATES_NOTE),
    { kind: 'link', label: 'Open the incident', url },
  ]);
}
