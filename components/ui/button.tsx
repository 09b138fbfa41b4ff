import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';

const variants: Record<Variant, string> = {
  primary: 'bg-ink text-paper hover:bg-ink-soft disabled:bg-ink-faint',
  secondary: 'border border-ink/30 bg-white/60 text-ink hover:bg-white disabled:text-ink-faint',
  quiet: 'text-ink hover:bg-paper-deep disabled:text-ink-faint',
  danger: 'border border-attention text-attention-ink hover:bg-attention-soft disabled:opacity-60',
};

export function buttonClasses(variant: Variant = 'primary', extra = ''): string {
  return `inline-flex min-h-touch items-center justify-center gap-2 rounded-md px-4 text-sm font-bold transition-colors disabled:cursor-not-allowed ${variants[variant]} ${extra}`;
}

export function Button({
  variant = 'primary',
  className = '',
  type = 'button',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button type={type} className={buttonClasses(variant, className)} {...props} />;
}
