import { ButtonLink } from '@/components/ui/button';
import { StatusPage } from './status-page';

export function NotFoundMessage() {
  return (
    <StatusPage
      eyebrow="Not found"
      title="There is no page here"
      actions={<ButtonLink to="/">Go to your home page</ButtonLink>}
    >
      <p>The address may be mistyped, or the record may have been removed or belong to another workspace.</p>
    </StatusPage>
  );
}
