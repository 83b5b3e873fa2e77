import { Link } from "react-router-dom";
import { paths } from "./paths";

export function NotFoundPage() {
  return (
    <div className="py-16 text-center">
      <h1 className="text-xl font-semibold text-ink-deep">Nothing here</h1>
      <p className="mt-2 text-sm text-ink-soft">
        The page you asked for does not exist or was moved.
      </p>
      <Link to={paths.sites} className="mt-4 inline-block text-sm text-ink underline">
        Back to sites
      </Link>
    </div>
  );
}
