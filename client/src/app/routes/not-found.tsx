import { Link } from 'react-router';
import { ContentLayout } from '../../components/layouts/content-layout';
import { buttonClasses } from '../../components/ui/button';

export default function NotFoundRoute() {
  return (
    <ContentLayout title="We could not find that page" lead="The link may be old, or the page has moved.">
      <div className="flex flex-wrap gap-3">
        <Link to="/" className={buttonClasses('primary')}>
          Back to the start
        </Link>
        <Link to="/library" className={buttonClasses('secondary')}>
          Search the Field Library
        </Link>
      </div>
    </ContentLayout>
  );
}
