// TODO(issue: Field Library, PRODUCT.md screen 8): placeholder so the route, its guard and the navigation exist. Replace this file.
import { PlaceholderPage } from '../../../components/layouts/placeholder-page';

export default function FieldLibraryRoute() {
  return <PlaceholderPage title="Field Library" />;
}
