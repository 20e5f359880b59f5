import { Link } from 'react-router-dom';
import { Card } from '../../components/ui/card';

export function NotFoundRoute() {
  return (
    <Card className="mx-auto flex max-w-2xl flex-col items-start gap-4">
      <title>Not found · Loftbench</title>
      <h1 className="text-2xl font-bold">Nothing at this address</h1>
      <p className="text-lg">The page you asked for does not exist. Check the address, or go back to the hull list.</p>
      <Link to="/hulls" className="inline-flex min-h-12 items-center font-semibold text-primary underline underline-offset-4">
        Back to the hull list
      </Link>
    </Card>
  );
}
