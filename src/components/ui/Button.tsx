import type { ButtonHTMLAttributes } from 'react';

type Kind = 'primary' | 'plain' | 'quiet';

const KIND_CLASSES: Record<Kind, string> = {
  primary: 'bg-accent text-accent-ink hover:bg-[#08524e] border-2 border-accent',
  plain: 'bg-card text-ink border-2 border-ink-soft hover:bg-accent-soft',
  quiet: 'bg-transparent text-ink border-2 border-transparent underline underline-offset-4 hover:bg-accent-soft',
};

export function Button({ kind = 'plain', className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { kind?: Kind }) {
  return (
    <button
      type="button"
      {...props}
      className={`min-h-12 min-w-12 rounded-lg px-5 py-2 font-semibold disabled:cursor-not-allowed disabled:opacity-60 ${KIND_CLASSES[kind]} ${className}`}
    />
  );
}
