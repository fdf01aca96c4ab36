// Any other /api/v1 path — a JSON 404 instead of the HTML not-found page
import { errorResponse, privateAnswer } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { translator } from "@/lib/i18n/translator";

const notFound = async () => privateAnswer(errorResponse(new AppError("notFound"), translator()));

export { notFound as GET, notFound as POST, notFound as PATCH, notFound as PUT, notFound as DELETE };
