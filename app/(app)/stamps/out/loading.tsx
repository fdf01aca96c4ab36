import { LoadingState } from "@/components/shell/loading-state";

// Only on pages that look nothing up by address: above a lookup, a loading boundary would send
// 200 before notFound() could answer 404.
export default LoadingState;
