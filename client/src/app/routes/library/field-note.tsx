// TODO(issue: field note page, PRODUCT.md screen 8): placeholder so the route, its guard and the navigation exist. Replace this file.
import { PlaceholderPage } from '../../../components/layouts/placeholder-page';

export default function FieldNoteRoute() {
  return <PlaceholderPage title="Field note" />;
}
