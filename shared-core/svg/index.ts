export { parseXml, walkElements, DEFAULT_XML_LIMITS, type XmlElement, type XmlLimits } from './parseXml';
export { readChartSvg, classesOf, SUMMARY_ID, type ChartSvgFile, type ChartSvgMark, type ChartSvgPiece, type ChartSvgPage, type ChartSvgLegendKey, type ChartSvgText, type PiecePart } from './readChartSvg';
export { writeSvg, escapeXmlAttr, escapeXmlText, SVG_DOCTYPE, type WriteSvgOptions } from './writeSvg';
export { NOT_XML_CHAR, toXmlChars } from './xmlChars';
