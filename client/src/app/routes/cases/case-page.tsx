// TODO(issue: case page, PRODUCT.md screen 4): placeholder so the route, its guard and the navigation exist. Replace this file.
import { PlaceholderPage } from '../../../components/layouts/placeholder-page';

export default function CasePageRoute() {
  return <PlaceholderPage title="Case" />;
}
