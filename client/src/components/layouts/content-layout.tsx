import type { ReactNode } from 'react';
import { cx } from '../ui/cx';

/** The one page width, shared by the header, the content and the footer so their edges line up. */
export const PAGE_WIDTH = 'mx-auto w-full max-w-6xl px-4 sm:px-6';

/** A page's frame inside the app layout: the document title, one h1, and the content. */
export function ContentLayout({
  title,
  lead,
  children,
  className,
}: {
  title: string;
  lead?: ReactNode;
  children?: ReactNode;
  className?: string;
}) {
  return (
    <div className={cx(PAGE_WIDTH, 'py-8 sm:py-10', className)}>
      <title>{`${title} · Sporewell`}</title>
      <h1 className="text-3xl font-extrabold tracking-tight sm:text-4xl">{title}</h1>
      {lead && <div className="mt-3 max-w-prose text-lg text-loam-soft">{lead}</div>}
      {children && <div className="mt-8">{children}</div>}
    </div>
  );
}
