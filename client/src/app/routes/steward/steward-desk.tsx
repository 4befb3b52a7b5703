// TODO(issue: steward desk, PRODUCT.md screen 10): placeholder so the route, its guard and the navigation exist. Replace this file.
import { PlaceholderPage } from '../../../components/layouts/placeholder-page';

export default function StewardDeskRoute() {
  return <PlaceholderPage title="Steward desk" />;
}
