/** What every template returns: a subject, a plain-text body and an HTML body. */
export interface RenderedMail {
  readonly template: string;
  readonly subject: string;
  readonly text: string;
  readonly html: string;
}

/** Escapes a value for HTML text or a double-quoted attribute. Every interpolated value goes through it. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string);
}

/** A plain, print-friendly HTML frame: paragraphs (already escaped) and an optional button link. */
export function htmlFrame(title: string, paragraphs: readonly string[], link?: { href: string; label: string }): string {
  const button = link
    ? `<p><a href="${escapeHtml(link.href)}" style="display:inline-block;padding:10px 18px;background:#1f3a5f;color:#fffdf7;text-decoration:none;border-radius:4px">${escapeHtml(link.label)}</a></p>` +
      `<p style="font-size:13px;color:#555">If the button does not work, copy this address into your browser:<br>${escapeHtml(link.href)}</p>`
    : '';
  return [
    '<!doctype html><html lang="en"><head><meta charset="utf-8">',
    `<title>${escapeHtml(title)}</title></head>`,
    '<body style="margin:0;padding:24px;background:#faf6ee;color:#1b2430;font-family:Georgia,serif;line-height:1.5">',
    '<div style="max-width:560px;margin:0 auto">',
    '<p style="font-family:sans-serif;font-weight:600;color:#1f3a5f">Flowlore</p>',
    ...paragraphs.map((p) => `<p>${p}</p>`),
    button,
    '<p style="font-size:13px;color:#555">You are receiving this because of an action on your Flowlore account.</p>',
    '</div></body></html>',
  ].join('');
}
