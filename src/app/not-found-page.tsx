import { useLocation } from 'react-router';
import { ButtonLink } from '@/components/ui/button-link';
import { EmptyState } from '@/components/ui/empty-state';

export function NotFoundPage() {
  const location = useLocation();
  return (
    <div className="py-8">
      <EmptyState title="There is no page here" action={<ButtonLink to="/">Go to my team</ButtonLink>}>
        <code className="rounded bg-paper-sunk px-1 text-micro">{location.pathname}</code> does not exist. Check the address, or start again from
        your team's home.
      </EmptyState>
    </div>
  );
}
