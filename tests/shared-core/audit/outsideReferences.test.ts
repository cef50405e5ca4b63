// Addresses in editor metadata: RDF/XML's rdf:resource (W3C RDF 1.1 XML Syntax §2.4: the object of a
// statement, an IRI) and Inkscape's sodipodi:absref (a linked image's absolute path). They are stripped
// from output files like any outside reference; rdf:about (the subject, RDF/XML §2.2) loads nothing and
// stays. Checked on the text with plain patterns, not with the module under test.
import { describe, expect, it } from 'vitest';
import { findOutsideReferences, removalNote, stripOutsideReferences } from '../../../shared-core/audit/outsideReferences';

// The metadata block an editor writes (element names from RDF, Dublin Core and Creative Commons; addresses invented).
const EDITED = `<svg xmlns="http://www.w3.org/2000/svg" xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#" xmlns:cc="http://creativecommons.org/ns#" xmlns:dc="http://purl.org/dc/elements/1.1/" xmlns:sodipodi="http://sodipodi.sourceforge.net/DTD/sodipodi-0.dtd" viewBox="0 0 10 10">
<metadata><rdf:RDF><cc:Work rdf:about=""><dc:type rdf:resource="http://purl.example/stillimage"/><cc:license rdf:resource="https://licences.example/by/4.0/"/><dc:source rdf:resource="#local-part"/></cc:Work></rdf:RDF></metadata>
<image sodipodi:absref="/home/client/secret-folder/photo.png" href="data:image/png;base64,iVBORw0KGgo=" width="1" height="1"/>
<rect width="4" height="4"/>
</svg>`;

describe('addresses in editor metadata', () => {
  it('strips rdf:resource and sodipodi:absref naming outside addresses, keeps fragments and rdf:about', () => {
    const found = findOutsideReferences(EDITED);
    expect(found.map((f) => f.kind)).toEqual(['metadata-address', 'metadata-address', 'metadata-address']);
    const { svg, removed } = stripOutsideReferences(EDITED);
    expect(removed.length).toBe(3);
    expect(svg).not.toMatch(/purl\.example|licences\.example|secret-folder/);
    expect(svg).toContain('rdf:resource="#local-part"');
    expect(svg).toContain('rdf:about=""');
    // Every other byte stays: the image, its embedded data and the rectangle.
    expect(svg).toContain('<image href="data:image/png;base64,iVBORw0KGgo=" width="1" height="1"/>');
    expect(svg).toContain('<rect width="4" height="4"/>');
    expect(removalNote(removed, 'The corrected file')?.message).toMatch(/3 addresses in editor metadata/);
  });

  it('finds them under any prefix the file binds to the RDF namespace', () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" xmlns:r="http://www.w3.org/1999/02/22-rdf-syntax-ns#"><metadata><r:Description r:resource="https://tracker.example/pixel"/></metadata></svg>';
    const { svg: out, removed } = stripOutsideReferences(svg);
    expect(removed.map((r) => r.kind)).toEqual(['metadata-address']);
    expect(out).not.toMatch(/tracker\.example/);
  });

  it('leaves an attribute of the same local name in another namespace alone', () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" xmlns:x="urn:example:other"><g x:resource="https://not.rdf.example/"/></svg>';
    expect(findOutsideReferences(svg)).toEqual([]);
  });
});
