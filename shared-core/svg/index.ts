export { parseXml, walkElements, DEFAULT_XML_LIMITS, type XmlElement, type XmlLimits } from './parseXml';
