import type { ComponentProps } from 'react';
import { cx } from './cx';

export function Card({ className, ...props }: ComponentProps<'div'>) {
  return <div className={cx('rounded-soft border border-line bg-rice-deep p-5 sm:p-6', className)} {...props} />;
}
