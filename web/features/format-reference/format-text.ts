// The format reference is docs/format.md itself, bundled as text at build time, so the
// page in the app and the repository's document can never say different things.
import formatText from '../../../docs/format.md?raw';

export { formatText };
