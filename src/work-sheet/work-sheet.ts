/** The work sheet's data lives in shared/work-sheet so the server's PDF says exactly what the page shows. */
export * from '@shared/work-sheet/work-sheet';
