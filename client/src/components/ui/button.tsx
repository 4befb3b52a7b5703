import type { ComponentProps } from 'react';
import { cx } from './cx';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';

const VARIANTS: Record<ButtonVariant, string> = {
  primary: 'bg-moss text-rice hover:bg-moss-deep',
  secondary: 'border-2 border-moss bg-rice text-moss-deep hover:bg-moss-mist',
  quiet: 'text-moss-deep underline underline-offset-4 hover:bg-moss-mist',
  // Reserved for discarding and other things that cannot be undone.
  danger: 'bg-ember text-rice hover:brightness-90',
};

/** The button look, for links that act as buttons (`<Link className={buttonClasses()}>`). */
export function buttonClasses(variant: ButtonVariant = 'primary', className?: string): string {
  return cx(
    // 44px minimum target (WCAG 2.5.5); gloved or muddy fingers miss small buttons.
    'inline-flex min-h-11 items-center justify-center gap-2 rounded-soft px-5 py-2 text-base font-bold no-underline',
    'transition-colors disabled:cursor-not-allowed disabled:opacity-60',
    VARIANTS[variant],
    className,
  );
}

export type ButtonProps = ComponentProps<'button'> & { variant?: ButtonVariant };

export function Button({ variant = 'primary', className, type = 'button', ...props }: ButtonProps) {
  return <button type={type} className={buttonClasses(variant, className)} {...props} />;
}
