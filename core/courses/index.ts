/** Heavy-metal course planner: catalogue, doses, dated schedules, safety rules (pure). */
export * from './drugs';
export * from './regimens';
export * from './wallClock';
export * from './orderName';
export * from './trientineBasis';
export * from './binding';
export * from './planCourse';
