/** Plain, accessible e-mails: a text part and a simple HTML part with the same link. */
export function linkMail(opts: { greeting: string; lines: string[]; linkLabel: string; link: string; footer: string }) {
  const text = [opts.greeting, '', ...opts.lines, '', `${opts.linkLabel}: ${opts.link}`, '', opts.footer].join('\n');
  const html = `<!doctype html><html><body style="font-family:sans-serif;line-height:1.5">
<p>${escapeHtml(opts.greeting)}</p>
${opts.lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('\n')}
<p><a href="${escapeHtml(opts.link)}">${escapeHtml(opts.linkLabel)}</a></p>
<p style="color:#555;font-size:90%">${escapeHtml(opts.footer)}</p>
</body></html>`;
  return { text, html };
}

/** A message without a link: greeting and lines, text and HTML. */
export function plainMail(opts: { greeting: string; lines: string[] }) {
  const text = [opts.greeting, '', ...opts.lines].join('\n');
  const html = `<!doctype html><html><body style="font-family:sans-serif;line-height:1.5">
<p>${escapeHtml(opts.greeting)}</p>
${opts.lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('\n')}
</body></html>`;
  return { text, html };
}

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
