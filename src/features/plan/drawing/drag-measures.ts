/**
 * Names of the performance measures a drag in the body plan records, kept until the next drag starts
 * (tests/bench/drawing-drag.ts reads them): each pointer move's handler, each frame's work, and each move
 * to the end of the frame that drew it.
 */
export const DRAG_MEASURES = { handler: 'loftbench:drag-move-handler', frame: 'loftbench:drag-frame-work', moveToPaint: 'loftbench:drag-move-to-paint' } as const;
