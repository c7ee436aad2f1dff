/**
 * A message's HTML in a sandboxed frame: no scripts, no access to the app. Links open in this tab
 * (the frame may navigate the top window only when the reader clicks).
 */
export function MailHtmlFrame({ html, title }: { html: string; title: string }) {
  const base = '<base target="_top">';
  const document = /<head[^>]*>/i.test(html)
    ? html.replace(/<head([^>]*)>/i, `<head$1>${base}`)
    : `<!doctype html><html><head><meta charset="utf-8">${base}</head><body>${html}</body></html>`;
  return (
    <iframe
      title={`Message: ${title}`}
      srcDoc={document}
      sandbox="allow-popups allow-top-navigation-by-user-activation"
      referrerPolicy="no-referrer"
      className="h-[26rem] w-full rounded-control border border-ink-100 bg-white"
    />
  );
}
