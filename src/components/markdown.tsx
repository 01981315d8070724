import ReactMarkdown, { defaultUrlTransform } from 'react-markdown';
import remarkGfm from 'remark-gfm';

const allowedSchemes = /^(https?:|mailto:)/i;

/** Only http(s) and mailto links survive; relative links stay; everything else becomes inert. */
export function safeUrl(url: string): string {
  const cleaned = defaultUrlTransform(url);
  if (!cleaned) return '';
  if (/^[a-z][a-z0-9+.-]*:/i.test(cleaned) && !allowedSchemes.test(cleaned)) return '';
  return cleaned;
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
          img: ({ src, alt }) =>
            typeof src === 'string' && src.startsWith('/media/') ? (
              <img src={src} alt={alt ?? ''} loading="lazy" />
            ) : (
              <span>{alt}</span>
            ),
        }}
      >
        {children}
      </ReactMarkdown>
    </div>
  );
}
