import { Link } from 'react-router';
import { ContentLayout } from '../layouts/content-layout';
import { buttonClasses } from '../ui/button';

/**
 * "Not found", for an address no route knows and for a page whose record is gone. A Field
 * Library page that is gone was usually taken out of the library (or its case renamed), so
 * there the library's search comes first.
 */
export function NotFoundPage({ libraryPage = false }: { libraryPage?: boolean }) {
  const search = (
    <Link to="/library" className={buttonClasses(libraryPage ? 'primary' : 'secondary')}>
      Search the Field Library
    </Link>
  );
  const start = (
    <Link to="/" className={buttonClasses(libraryPage ? 'secondary' : 'primary')}>
      Back to the start
    </Link>
  );
  return (
    <ContentLayout
      title={libraryPage ? 'That Field Library page is not there' : 'We could not find that page'}
      lead={libraryPage ? 'It may have been taken out of the library or renamed. Search for what it was about.' : 'The link may be old, or the page has moved.'}
    >
      <div className="flex flex-wrap gap-3">
        {libraryPage ? search : start}
        {libraryPage ? start : search}
      </div>
    </ContentLayout>
  );
}
