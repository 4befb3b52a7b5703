// TODO(issue: batch shelf, PRODUCT.md screen 2): placeholder so the route, its guard and the navigation exist. Replace this file.
import { PlaceholderPage } from '../../../components/layouts/placeholder-page';

export default function BatchShelfRoute() {
  return <PlaceholderPage title="Batch shelf" />;
}
