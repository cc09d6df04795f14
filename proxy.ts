// Early redirect of anonymous visitors to the sign-in page. It only redirects: every page, route
// and query checks the user again on the server.
import { withAuth } from "next-auth/middleware";

export default withAuth({ pages: { signIn: "/login" } });

export const config = { matcher: ["/jobs/:path*", "/registers/:path*"] };
