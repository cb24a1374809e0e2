export { formatElevation } from '../../wording.ts';
