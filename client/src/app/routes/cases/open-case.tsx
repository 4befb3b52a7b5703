// TODO(issue: open a case, PRODUCT.md screen 3): placeholder so the route, its guard and the navigation exist. Replace this file.
import { PlaceholderPage } from '../../../components/layouts/placeholder-page';

export default function OpenCaseRoute() {
  return <PlaceholderPage title="Open a case" />;
}
