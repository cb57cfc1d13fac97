import MailComposer from 'nodemailer/lib/mail-composer';
import { describe, expect, it } from 'vitest';
import { parseMail } from './mail-reader';

/** A minimal single-part message with the given header lines. */
const rawMessage = (headers: string[], body = '') => Buffer.from([...headers, '', body].join('\r\n'), 'latin1');

/** Builds the raw message with nodemailer's own composer, the writer whose output the reader must handle. */
const compose = (options: ConstructorParameters<typeof MailComposer>[0]) => new MailComposer(options).compile().build();

describe('encoded words in headers (RFC 2047)', () => {
  // RFC 2047 §8, "Examples" (the table of encoded forms and how they display).
  it.each([
    ['(=?ISO-8859-1?Q?a?=)', '(a)'],
    ['(=?ISO-8859-1?Q?a?= b)', '(a b)'],
    ['(=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=)', '(ab)'],
    ['(=?ISO-8859-1?Q?a?=  =?ISO-8859-1?Q?b?=)', '(ab)'],
    ['(=?ISO-8859-1?Q?a_b?=)', '(a b)'],
    ['(=?ISO-8859-1?Q?a?= =?ISO-8859-2?Q?_b?=)', '(a b)'],
    ['=?ISO-8859-1?Q?Andr=E9?= Pirard <PIRARD@vm1.ulg.ac.be>', 'André Pirard <PIRARD@vm1.ulg.ac.be>'],
    ['=?ISO-8859-1?Q?Keld_J=F8rn_Simonsen?= <keld@dkuug.dk>', 'Keld Jørn Simonsen <keld@dkuug.dk>'],
  ])('%s → %s', async (encoded, decoded) => {
    expect((await parseMail(rawMessage([`Subject: ${encoded}`], 'x'))).subject).toBe(decoded);
  });

  it('decodes base64 words (RFC 2047 §4.1)', async () => {
    const subject = `=?UTF-8?B?${Buffer.from('ε/k_B = 131.5 K').toString('base64')}?=`;
    expect((await parseMail(rawMessage([`Subject: ${subject}`], 'x'))).subject).toBe('ε/k_B = 131.5 K');
  });
});

describe('quoted-printable bodies (RFC 2045 §6.7)', () => {
  const qp = (body: string) =>
    parseMail(rawMessage(['Content-Type: text/plain; charset=utf-8', 'Content-Transfer-Encoding: quoted-printable'], body));
  it('joins soft line breaks (rule 5) and decodes =XX octets (rule 1)', async () => {
    // RFC 2045 §6.7 rule 5 example, from memory.
    expect((await qp("Now's the time =\r\nfor all folk to come=\r\n to the aid of their country.")).text).toBe(
      "Now's the time for all folk to come to the aid of their country.",
    );
    expect((await qp('caf=C3=A9 =3D 1')).text).toBe('café = 1');
  });

  it('drops trailing white space before a line break (rule 3)', async () => {
    expect((await qp('a  \r\nb')).text).toMatch(/^a\r?\nb$/);
  });
});

describe('parseMail on what nodemailer writes', () => {
  it('reads a multipart/alternative message with non-ASCII subject, long quoted-printable lines and HTML', async () => {
    const longLine = `σ = 3.524 Å and ε/k_B = 131.5 K; ${'the fit converged after twelve iterations '.repeat(4)}`;
    const raw = await compose({
      from: 'Epsigma <epsigma@localhost>',
      to: ['reviewer@demo.epsigma.test', '"Lindqvist, Rhea" <rhea@demo.epsigma.test>'],
      subject: 'Quillgas QG-1 v3 — submitted for review',
      text: `${longLine}\nSecond line.`,
      html: `<p>${longLine}</p><p>Second &amp; last</p>`,
      messageId: '<m1@epsigma.test>',
    });
    const mail = await parseMail(raw);
    expect(mail.subject).toBe('Quillgas QG-1 v3 — submitted for review');
    expect(mail.to).toEqual(['reviewer@demo.epsigma.test', 'rhea@demo.epsigma.test']);
    expect(mail.from).toBe('Epsigma <epsigma@localhost>');
    expect(mail.messageId).toBe('<m1@epsigma.test>');
    expect(mail.text).toBe(`${longLine}\nSecond line.`);
    expect(mail.html).toBe(`<p>${longLine}</p><p>Second &amp; last</p>`);
  });

  it('reads base64 bodies and skips attachments in multipart/mixed', async () => {
    const raw = await compose({
      from: 'a@b.test',
      to: 'c@d.test',
      subject: 'plain',
      text: 'Grüße aus dem Labor',
      textEncoding: 'base64',
      attachments: [{ filename: 'note.txt', content: 'not the body' }],
    });
    const mail = await parseMail(raw);
    expect(mail.text).toBe('Grüße aus dem Labor');
    expect(mail.html).toBeNull();
  });

  it('reads a single-part text message', async () => {
    const mail = await parseMail(await compose({ from: 'a@b.test', to: 'c@d.test', subject: 'only text', text: 'hello' }));
    expect(mail).toMatchObject({ subject: 'only text', text: 'hello', html: null, to: ['c@d.test'] });
  });
});

describe('recipients', () => {
  it('keeps addresses and drops display names, including quoted commas', async () => {
    expect((await parseMail(rawMessage(['To: "Doe, Jane" <jane@x.test>, bob@y.test'], 'x'))).to).toEqual(['jane@x.test', 'bob@y.test']);
    expect((await parseMail(rawMessage(['Subject: none'], 'x'))).to).toEqual([]);
  });
});
