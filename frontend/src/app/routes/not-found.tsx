import { NotFoundMessage } from '@/components/errors/not-found-message';

export default function NotFoundRoute() {
  return <NotFoundMessage />;
}
