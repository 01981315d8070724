import ReactMarkdown, { defaultUrlTransform } from 'react-markdown';
import remarkGfm from 'remark-gfm';
import { photoIdPattern } from '@shared/schemas/params';

const allowedSchemes = /^(https?:|mailto:)/i;
// only a stand-in origin to resolve relative addresses against; never requested
const base = 'https://swapyard.invalid';

/**
 * Only http(s) and mailto links survive; everything else becomes inert. A relative address is resolved
 * the way a browser will resolve it (dot segments, backslashes, `//host`), so what is checked and shown
 * is where it really goes: `/media/../l/x` becomes `/l/x`, `//host/x` becomes `https://host/x`.
 */
export function safeUrl(url: string): string {
  const cleaned = defaultUrlTransform(url);
  if (!cleaned) return '';
  if (/^[a-z][a-z0-9+.-]*:/i.test(cleaned)) return allowedSchemes.test(cleaned) ? cleaned : '';
  if (cleaned.startsWith('#') || cleaned.startsWith('?')) return cleaned;
  let resolved: URL;
  try {
    resolved = new URL(cleaned, `${base}/`);
  } catch {
    return '';
  }
  if (resolved.origin !== base) return resolved.protocol === 'https:' || resolved.protocol === 'http:' ? resolved.href : '';
  return resolved.pathname + resolved.search + resolved.hash;
}

const mediaSrc = /^\/media\/([^/?#]+)(?:\?size=(?:thumb|full))?$/;

/**
 * Images load without a click, so they are limited to our own stored photos, written exactly
 * (`/media/<id>`, optionally `?size=thumb`): nothing a browser would normalise to another address.
 */
export function mediaImageSrc(src: unknown): string | null {
  if (typeof src !== 'string') return null;
  const m = mediaSrc.exec(src);
  return m && photoIdPattern.test(m[1]) ? src : null;
}

/**
 * The one markdown renderer: the sheet, the form preview, shop notes. GFM tables and task lists;
 * raw HTML is never rendered (react-markdown ignores it without rehype-raw).
 */
export function Markdown({ children, className = '' }: { children: string; className?: string }) {
  return (
    <div className={`prose prose-neutral max-w-none prose-headings:text-ink prose-a:text-ink prose-table:text-sm ${className}`}>
      <ReactMarkdown
        remarkPlugins={[remarkGfm]}
        skipHtml
        urlTransform={safeUrl}
        components={{
          a: ({ href, children: text }) =>
            href ? (
              <a href={href} rel="nofollow noopener noreferrer" target={href.startsWith('/') ? undefined : '_blank'}>
                {text}
              </a>
            ) : (
              <span>{text}</span>
            ),
          // GFM task lists: a read-only box that says its state, since the item text is not its label
          input: ({ type, checked }) =>
            type === 'checkbox' ? (
              <input type="checkbox" checked={Boolean(checked)} disabled readOnly aria-label={checked ? 'Done' : 'Not done'} />
            ) : null,
          img: ({ src, alt }) => {
            const own = mediaImageSrc(src);
            return own ? <img src={own} alt={alt ?? ''} loading="lazy" /> : <span>{alt}</span>;
          },
        }}
      >
        {children}
      </ReactMarkdown>
    </div>
  );
}
