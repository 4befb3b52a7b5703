// TODO(issue: mentor profile, PRODUCT.md screen 9): placeholder so the route, its guard and the navigation exist. Replace this file.
import { PlaceholderPage } from '../../../components/layouts/placeholder-page';

export default function MentorProfileRoute() {
  return <PlaceholderPage title="Mentor profile" />;
}
