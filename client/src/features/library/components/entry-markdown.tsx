import Markdown, { type Components } from 'react-markdown';

// Guides and field notes are Markdown. Raw HTML in them is dropped (skipHtml; rehype-raw is not
// used), images are not loaded (a field note's text came from a grower; an image link could
// track its readers), and links leaving Sporewell open without passing on where they came from.
const COMPONENTS: Components = {
  h1: ({ children }) => <h2 className="mt-8 text-2xl font-extrabold">{children}</h2>,
  h2: ({ children }) => <h2 className="mt-8 text-2xl font-extrabold">{children}</h2>,
  h3: ({ children }) => <h3 className="mt-6 text-xl font-extrabold">{children}</h3>,
  h4: ({ children }) => <h4 className="mt-4 text-lg font-extrabold">{children}</h4>,
  p: ({ children }) => <p className="mt-3">{children}</p>,
  ul: ({ children }) => <ul className="mt-3 list-disc space-y-1 pl-6">{children}</ul>,
  ol: ({ children }) => <ol className="mt-3 list-decimal space-y-1 pl-6">{children}</ol>,
  blockquote: ({ children }) => <blockquote className="mt-3 border-l-4 border-moss pl-4 italic text-loam-soft">{children}</blockquote>,
  code: ({ children }) => <code className="rounded bg-rice-deep px-1">{children}</code>,
  a: ({ href, children }) => {
    const external = !!href && /^https?:\/\//i.test(href);
    return (
      <a href={href} {...(external ? { rel: 'noopener noreferrer nofollow', target: '_blank' } : {})}>
        {children}
        {external && <span className="sr-only"> (opens another site)</span>}
      </a>
    );
  },
};

export function EntryMarkdown({ body }: { body: string }) {
  return (
    <div className="max-w-prose">
      <Markdown skipHtml disallowedElements={['img']} unwrapDisallowed components={COMPONENTS}>
        {body}
      </Markdown>
    </div>
  );
}
