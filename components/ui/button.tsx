import Link from 'next/link';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';
const styles: Record<Variant, string> = {
  primary: 'bg-tide-600 text-white hover:bg-tide-700 border-tide-700',
  secondary: 'bg-paper-raised text-ink hover:bg-paper-sunk border-rule-strong',
  danger: 'bg-paper-raised text-state-action hover:bg-state-actionbg border-state-action/50',
  ghost: 'bg-transparent text-tide-600 hover:bg-tide-50 border-transparent',
};

/**
 * A button's classes: Button's and ButtonLink's, and markup's built outside React (the asset page's static tables).
 * The shape is app/globals.css's .btn (a phone's buttons are at least 44 px high); a smaller button adds text-xs.
 */
export const buttonClassName = (variant: Variant = 'primary', className = '') => `btn ${styles[variant]} ${className}`;

export function Button({ variant = 'primary', className = '', ...props }: React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button className={buttonClassName(variant, className)} {...props} />;
}

export function ButtonLink({ variant = 'primary', className = '', ...props }: React.ComponentProps<typeof Link> & { variant?: Variant }) {
  return <Link className={buttonClassName(variant, className)} {...props} />;
}
