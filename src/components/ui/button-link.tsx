import { Link, type LinkProps } from 'react-router-dom';
import { buttonClasses, type ButtonVariant } from './button';

/** A link that looks like a button: for actions that go to another page. */
export function ButtonLink({ variant = 'primary', className = '', ...props }: LinkProps & { variant?: ButtonVariant }) {
  return <Link className={buttonClasses(variant, className)} {...props} />;
}
