// Requests to the stamp keepers: stamps to check out (stamp-requests) and new stamps to make (new-stamp-requests).
export { acceptStampRequest, checkOutDueRequests, createStampRequest, declineStampRequest, getStampRequest, listStampRequests } from "./stamp-requests";
export {
  attachNewStampSketch,
  createNewStampRequest,
  declineNewStampRequest,
  fulfilNewStampRequest,
  getNewStampRequest,
  listNewStampRequests,
  newStampSketch,
  sketchOfStamp,
  type SketchUpload,
} from "./new-stamp-requests";
