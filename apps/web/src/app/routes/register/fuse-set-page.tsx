import { componentRecordRoute } from './component-record';

const route = componentRecordRoute('fuse-sets');
export const clientLoader = route.clientLoader;
export default route.ComponentRecordPage;
