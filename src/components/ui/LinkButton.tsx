import type { AnchorHTMLAttributes } from 'react';
import { Link, type LinkProps } from 'react-router-dom';

const CLASSES = 'inline-flex min-h-12 items-center rounded-lg border-2 px-4 py-2 font-semibold no-underline';
const KIND = { primary: 'border-accent bg-accent text-accent-ink hover:bg-[#08524e]', plain: 'border-ink-soft bg-card text-ink hover:bg-accent-soft' } as const;

/** A router link that looks like a button. */
export function LinkButton({ kind = 'plain', className = '', ...props }: LinkProps & { kind?: keyof typeof KIND }) {
  return <Link {...props} className={`${CLASSES} ${KIND[kind]} ${className}`} />;
}

/** A file download that looks like a button. */
export function DownloadLink({ className = '', ...props }: AnchorHTMLAttributes<HTMLAnchorElement>) {
  return <a download {...props} className={`${CLASSES} ${KIND.plain} ${className}`} />;
}
