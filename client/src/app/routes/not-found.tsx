import { NotFoundPage } from '../../components/errors/not-found-page';

export default function NotFoundRoute() {
  return <NotFoundPage />;
}
