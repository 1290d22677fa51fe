import {
  ESTIMATES_NOTE,
  MailTemplateError,
  escapeHtml,
  invitation,
  planSubmitted,
  reviewDecided,
  type MailContent,
} from '@/server/mail/templates';

const base = 'https://kenning.demo.kenning.test';

const invite = {
  name: 'Ada Fenwick',
  organizationName: 'Harrowmere Lookout Service',
  setPasswordUrl: `${base}/set-password?token=Zq3-abc_123`,
  invitedBy: 'Rowan Tull',
};
const submitted = {
  planTitle: 'Ridge line cover',
  siteName: 'Cold Fell tower',
  version: 3,
  preparedBy: 'Ada Fenwick',
  reviewUrl: `${base}/plans/7f0c`,
};
const decided = {
  planTitle: 'Ridge line cover',
  decision: 'approved' as const,
  reviewer: 'Rowan Tull',
  comment: 'Good to go.',
  planUrl: `${base}/plans/7f0c`,
};

/** Every message, for the checks that apply to all of them. */
const all: Array<[string, () => MailContent]> = [
  ['invitation', () => invitation(invite)],
  ['planSubmitted', () => planSubmitted(submitted)],
  ['reviewDecided (approved)', () => reviewDecided(decided)],
  ['reviewDecided (returned)', () => reviewDecided({ ...decided, decision: 'returned' })],
];

describe('every message', () => {
  it.each(all)('%s ends with the planning-estimates line, in text and in html', (_name, build) => {
    const mail = build();
    expect(mail.text.trimEnd().endsWith(ESTIMATES_NOTE)).toBe(true);
    expect(mail.html).toContain(escapeHtml(ESTIMATES_NOTE));
  });

  it.each(all)('%s has a one-line subject and a complete html document', (_name, build) => {
    const mail = build();
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(mail.subject.length).toBeGreaterThan(0);
    expect(mail.html.startsWith('<!doctype html>')).toBe(true);
    expect(mail.html).toContain('</html>');
  });

  it.each(all)('%s is deterministic', (_name, build) => {
    expect(build()).toEqual(build());
  });
});

describe('invitation', () => {
  it('names the organisation and the inviter and carries the set-password link in both versions', () => {
    const mail = invitation(invite);
    expect(mail.subject).toBe('Set up your Kenning account for Harrowmere Lookout Service');
    expect(mail.text).toContain('Hello Ada Fenwick,');
    expect(mail.text).toContain('Rowan Tull has given you an account for Harrowmere Lookout Service');
    expect(mail.text).toContain(invite.setPasswordUrl);
    expect(mail.html).toContain(`href="${invite.setPasswordUrl}"`);
    expect(mail.html).toContain('Choose a password');
  });

  it('escapes every value in the html but leaves the plain text as written', () => {
    const mail = invitation({
      ...invite,
      name: '<script>alert("hi")</script>',
      organizationName: 'Fenwick & Tull <Lookouts>',
      invitedBy: `O'Hara`,
    });
    expect(mail.html).not.toContain('<script>');
    expect(mail.html).toContain('&#60;script&#62;alert(&#34;hi&#34;)&#60;/script&#62;');
    expect(mail.html).toContain('Fenwick &#38; Tull &#60;Lookouts&#62;');
    expect(mail.html).toContain('O&#39;Hara');
    expect(mail.text).toContain('Hello <script>alert("hi")</script>,');
    expect(mail.subject).toBe('Set up your Kenning account for Fenwick & Tull <Lookouts>');
  });

  it('escapes the ampersands of a link inside the href', () => {
    const url = `${base}/set-password?token=abc&from=invite`;
    const mail = invitation({ ...invite, setPasswordUrl: url });
    expect(mail.html).toContain(`href="${base}/set-password?token=abc&#38;from=invite"`);
    expect(mail.text).toContain(url);
  });

  it('greets without a name when none is given', () => {
    expect(invitation({ ...invite, name: '  ' }).text.startsWith('Hello,\n')).toBe(true);
  });

  it.each([
    ['javascript:alert(1)', /http\(s\)/],
    ['/set-password?token=abc', /absolute URL/],
    ['not a url', /absolute URL/],
    ['ftp://files.demo.kenning.test/x', /http\(s\)/],
  ])('refuses the link %s', (setPasswordUrl, why) => {
    expect(() => invitation({ ...invite, setPasswordUrl })).toThrow(MailTemplateError);
    expect(() => invitation({ ...invite, setPasswordUrl })).toThrow(why);
  });

  it('does not mutate its input', () => {
    const input = Object.freeze({ ...invite });
    invitation(input);
    expect(input).toEqual(invite);
  });
});

describe('planSubmitted', () => {
  it('lists plan, site, version and planner, with the review link', () => {
    const mail = planSubmitted(submitted);
    expect(mail.subject).toBe('For review: Ridge line cover (version 3)');
    expect(mail.text).toContain('Ada Fenwick has submitted a plan for review.');
    expect(mail.text).toContain('Plan: Ridge line cover\nSite: Cold Fell tower\nVersion: 3\nPrepared by: Ada Fenwick');
    expect(mail.text).toContain(submitted.reviewUrl);
    expect(mail.html).toContain(`href="${submitted.reviewUrl}"`);
    expect(mail.html).toContain('Review the plan');
  });

  it('keeps line breaks out of the subject (no header injection through a title)', () => {
    const mail = planSubmitted({ ...submitted, planTitle: 'Ridge\r\nBcc: someone@elsewhere.test' });
    expect(mail.subject).toBe('For review: Ridge Bcc: someone@elsewhere.test (version 3)');
  });

  it('escapes the site name in the html table', () => {
    expect(planSubmitted({ ...submitted, siteName: 'Tower <b>9</b>' }).html).toContain('Tower &#60;b&#62;9&#60;/b&#62;');
  });

  it('refuses a review link that is not http(s)', () => {
    expect(() => planSubmitted({ ...submitted, reviewUrl: 'data:text/html,hi' })).toThrow(MailTemplateError);
  });
});

describe('reviewDecided', () => {
  it('approved: says so in the subject and body and quotes the comment', () => {
    const mail = reviewDecided(decided);
    expect(mail.subject).toBe('Approved: Ridge line cover');
    expect(mail.text).toContain('Rowan Tull has approved your plan “Ridge line cover”.');
    expect(mail.text).toContain('Rowan Tull wrote:\n\n> Good to go.');
    expect(mail.text).not.toMatch(/returned|changes/i);
    expect(mail.html).toContain(`href="${decided.planUrl}"`);
  });

  it('returned: asks for changes and a new submission', () => {
    const mail = reviewDecided({ ...decided, decision: 'returned', comment: 'Add the north slope.\nCheck the mast height.' });
    expect(mail.subject).toBe('Returned for changes: Ridge line cover');
    expect(mail.text).toContain('Rowan Tull has returned your plan “Ridge line cover” for changes.');
    expect(mail.text).toContain('> Add the north slope.\n> Check the mast height.');
    expect(mail.text).toContain('submit the plan again');
    expect(mail.text).not.toMatch(/approved/i);
    expect(mail.text).toContain(decided.planUrl);
  });

  it('returned without a comment says no comment was left', () => {
    const mail = reviewDecided({ ...decided, decision: 'returned', comment: '   ' });
    expect(mail.text).toContain('Rowan Tull left no comment');
    expect(mail.text).not.toContain('wrote:');
  });

  it('approved without a comment leaves the comment out entirely', () => {
    for (const comment of [null, undefined, '']) {
      const mail = reviewDecided({ ...decided, comment });
      expect(mail.text).not.toContain('wrote:');
      expect(mail.text).not.toContain('no comment');
      expect(mail.html).not.toContain('<blockquote');
    }
  });

  it('escapes the comment in the html and keeps its line breaks', () => {
    const mail = reviewDecided({ ...decided, comment: 'Fine <img src=x onerror=alert(1)>\nsecond line' });
    expect(mail.html).not.toContain('<img');
    expect(mail.html).toMatch(
      /<blockquote[^>]*white-space:pre-wrap[^>]*>Fine &#60;img src=x onerror=alert\(1\)&#62;\nsecond line<\/blockquote>/,
    );
  });

  it('refuses a decision it does not know', () => {
    expect(() => reviewDecided({ ...decided, decision: 'maybe' as 'approved' })).toThrow(MailTemplateError);
  });
});

describe('escapeHtml', () => {
  it('escapes the five special characters and nothing else', () => {
    expect(escapeHtml(`<a href="x">Tom & Jerry's</a> é`)).toBe('&#60;a href=&#34;x&#34;&#62;Tom &#38; Jerry&#39;s&#60;/a&#62; é');
  });
});
