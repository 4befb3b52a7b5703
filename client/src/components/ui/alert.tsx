import type { ComponentProps, ReactNode } from 'react';
import { cx } from './cx';

export type AlertTone = 'info' | 'success' | 'warning' | 'danger';

const TONES: Record<AlertTone, string> = {
  info: 'border-loam-soft bg-rice-deep text-loam',
  success: 'border-moss bg-moss-mist text-moss-deep',
  warning: 'border-clay bg-clay-mist text-clay-deep',
  danger: 'border-ember bg-ember-mist text-ember',
};

export type AlertProps = Omit<ComponentProps<'div'>, 'title'> & { tone?: AlertTone; title?: ReactNode };

/** Danger alerts are announced at once (role="alert"); the others politely (role="status"). */
export function Alert({ tone = 'info', title, children, className, role, ...props }: AlertProps) {
  return (
    <div
      role={role ?? (tone === 'danger' ? 'alert' : 'status')}
      className={cx('rounded-soft border-l-8 px-4 py-3', TONES[tone], className)}
      {...props}
    >
      {title && <p className="font-extrabold">{title}</p>}
      {children && <div className={cx(title ? 'mt-1' : undefined, 'text-loam')}>{children}</div>}
    </div>
  );
}
