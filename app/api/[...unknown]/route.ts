import { jsonError } from "@/server/api/handler";

// Any /api path without a handler answers JSON, never the HTML not-found page.
function notFound() {
  return jsonError(404, "No such API endpoint");
}

export {
  notFound as GET,
  notFound as POST,
  notFound as PUT,
  notFound as PATCH,
  notFound as DELETE,
};
