// TODO(issue: rounds, PRODUCT.md screen 5): placeholder so the route, its guard and the navigation exist. Replace this file.
import { PlaceholderPage } from '../../../components/layouts/placeholder-page';

export default function RoundsRoute() {
  return <PlaceholderPage title="Rounds" />;
}
