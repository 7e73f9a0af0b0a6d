/** The study history timeline, for any page that shows a study (the studies feature mounts it as a History tab). */
export { StudyHistory } from './study-history';
