// The preview's own request between the Counterpoise client and server. Imports only types, so
// the client can share it.
import type { ViewModel } from "../view";

/** Client → server: the arm view model of an open document (null if it is not open). */
export const ARM_VIEW_REQUEST = "counterpoise/armView";

export interface ArmViewParams {
  uri: string;
}

export type ArmViewResult = ViewModel | null;
