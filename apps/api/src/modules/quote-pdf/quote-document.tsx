import { Document, Image, Page, StyleSheet, Text, View } from '@react-pdf/renderer';
import { PDF_FONT } from './fonts';
import type { PdfLine, PdfSection, QuotePdfModel } from './pdf-model';

/** Gloaming's own quote layout: dusk blue for structure, lamp amber for the few accents. */
const ink = '#1b2552';
const muted = '#5a607a';
const rule = '#dcdfe9';
const wash = '#f3f5fc';
const lamp = '#b86c0c';
const lampWash = '#fff8ec';

const s = StyleSheet.create({
  // no lineHeight on the Page itself: it hides the fixed footer (react-pdf 4.9)
  page: { fontFamily: PDF_FONT, fontSize: 9, color: ink, paddingTop: 40, paddingBottom: 56, paddingHorizontal: 44 },
  header: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-start' },
  firmName: { fontSize: 16, fontWeight: 700, color: ink },
  firmLines: { color: muted, marginTop: 3 },
  logo: { maxWidth: 160, maxHeight: 56, objectFit: 'contain' },
  docTitleBlock: { alignItems: 'flex-end' },
  docTitle: { fontSize: 20, fontWeight: 600, color: ink, lineHeight: 1.2 },
  docRef: { color: muted, marginTop: 4 },
  accent: { height: 3, backgroundColor: lamp, marginTop: 14, marginBottom: 16, width: 64 },
  parties: { flexDirection: 'row', gap: 16, marginBottom: 16 },
  party: { flex: 1, backgroundColor: wash, borderRadius: 4, padding: 10 },
  label: { fontSize: 7.5, fontWeight: 600, color: muted, textTransform: 'uppercase', letterSpacing: 0.6, marginBottom: 4 },
  strong: { fontWeight: 600 },
  detailRow: { flexDirection: 'row', justifyContent: 'space-between', marginBottom: 1.5 },
  detailKey: { color: muted },
  intro: { marginBottom: 14, fontSize: 9.5, lineHeight: 1.4 },
  para: { fontSize: 9, lineHeight: 1.4 },
  // the space between sections is a gap, not a margin: a gap is dropped at a page break,
  // a margin would carry the table (and its repeated column heads) onto the next page
  sections: { gap: 12, marginBottom: 12 },
  sectionHead: {
    flexDirection: 'row',
    justifyContent: 'space-between',
    borderBottomWidth: 1,
    borderBottomColor: ink,
    paddingBottom: 3,
    marginBottom: 2,
  },
  sectionName: { fontSize: 11, fontWeight: 600 },
  colHead: {
    flexDirection: 'row',
    paddingVertical: 3,
    color: muted,
    fontSize: 7.5,
    fontWeight: 600,
    textTransform: 'uppercase',
    letterSpacing: 0.4,
  },
  row: { flexDirection: 'row', paddingVertical: 4, borderBottomWidth: 0.5, borderBottomColor: rule },
  rowAside: { backgroundColor: lampWash },
  cDesc: { flex: 1, paddingRight: 8 },
  cQty: { width: 62, textAlign: 'right' },
  cUnit: { width: 68, textAlign: 'right' },
  cVat: { width: 34, textAlign: 'right' },
  cAmount: { width: 72, textAlign: 'right' },
  note: { color: muted, fontSize: 8, marginTop: 1 },
  tag: { fontSize: 7, fontWeight: 600, color: lamp, textTransform: 'uppercase', letterSpacing: 0.4, marginBottom: 1 },
  notCounted: { color: muted },
  sectionSubtotal: { flexDirection: 'row', justifyContent: 'flex-end', paddingTop: 3, color: muted },
  totalsWrap: { flexDirection: 'row', justifyContent: 'flex-end', marginTop: 4 },
  totals: { width: 250 },
  totalRow: { flexDirection: 'row', justifyContent: 'space-between', paddingVertical: 2.5 },
  grandRow: {
    flexDirection: 'row',
    justifyContent: 'space-between',
    paddingVertical: 5,
    marginTop: 3,
    borderTopWidth: 1.5,
    borderTopColor: ink,
  },
  grand: { fontSize: 12, fontWeight: 700 },
  depositBox: { marginTop: 8, borderWidth: 1, borderColor: lamp, borderRadius: 4, padding: 8, backgroundColor: lampWash },
  small: { fontSize: 8, color: muted },
  block: { marginTop: 14 },
  blockTitle: { fontSize: 10, fontWeight: 600, marginBottom: 4 },
  safety: {
    lineHeight: 1.4,
    marginTop: 12,
    borderLeftWidth: 3,
    borderLeftColor: lamp,
    paddingLeft: 8,
    paddingVertical: 4,
    fontSize: 8.5,
  },
  // two photos a row, one row at a time: a wrapping grid is one block to the paginator
  photoRow: { flexDirection: 'row', justifyContent: 'space-between' },
  photo: { width: '48.5%', marginBottom: 14 },
  photoImage: { width: '100%', height: 190, objectFit: 'cover', borderRadius: 3 },
  caption: { marginTop: 4, fontSize: 8.5, color: muted },
  footer: {
    position: 'absolute',
    bottom: 24,
    left: 44,
    right: 44,
    flexDirection: 'row',
    justifyContent: 'space-between',
    fontSize: 7.5,
    color: muted,
    borderTopWidth: 0.5,
    borderTopColor: rule,
    paddingTop: 6,
  },
});

/** The last line keeps the subtotal company: a continued table never shows a subtotal alone. */
function LineRow({ line, last }: { line: PdfLine; last: boolean }) {
  const aside = line.kind !== 'standard';
  const tag =
    line.kind === 'optional'
      ? `Optional extra · ${line.included ? 'included' : 'not included'}`
      : line.kind === 'alternative'
        ? `Choose one${line.group ? `: ${line.group}` : ''} · ${line.included ? 'included' : 'alternative'}`
        : '';
  return (
    <View style={aside ? [s.row, s.rowAside] : s.row} wrap={false} minPresenceAhead={last ? 18 : undefined}>
      <View style={s.cDesc}>
        {tag ? <Text style={s.tag}>{tag}</Text> : null}
        <Text>{line.description || '—'}</Text>
        {line.note ? <Text style={s.note}>{line.note}</Text> : null}
        {line.discount ? <Text style={s.note}>{line.discount}</Text> : null}
      </View>
      <Text style={s.cQty}>{line.quantity}</Text>
      <Text style={s.cUnit}>{line.unitPrice}</Text>
      <Text style={s.cVat}>{line.vatRate}</Text>
      <Text style={line.included ? s.cAmount : [s.cAmount, s.notCounted]}>
        {line.included ? line.lineTotal : `(${line.lineTotal})`}
      </Text>
    </View>
  );
}

/**
 * The heading keeps its column heads and first line company (minPresenceAhead). The
 * paginator honours that only for a node with a break before it in the same column, and
 * a column's first child has none: the empty View in front gives it one, so a heading
 * that would end a page moves to the next one with its table. The column heads repeat
 * (`fixed`) on every page the table continues on.
 */
function Section({ section }: { section: PdfSection }) {
  return (
    <View>
      <View />
      <View style={s.sectionHead} wrap={false} minPresenceAhead={40}>
        <Text style={s.sectionName}>{section.name}</Text>
      </View>
      <View style={s.colHead} fixed wrap={false}>
        <Text style={s.cDesc}>Description</Text>
        <Text style={s.cQty}>Qty</Text>
        <Text style={s.cUnit}>Unit price</Text>
        <Text style={s.cVat}>VAT</Text>
        <Text style={s.cAmount}>Amount</Text>
      </View>
      {section.lines.map((line, i) => (
        <LineRow key={i} line={line} last={i === section.lines.length - 1} />
      ))}
      <View style={s.sectionSubtotal} wrap={false}>
        <Text>
          {section.name} subtotal (ex VAT): <Text style={s.strong}>{section.subtotal}</Text>
        </Text>
      </View>
    </View>
  );
}

/** The photos two by two, the last row possibly alone. */
function pairs<T>(items: T[]): T[][] {
  const rows: T[][] = [];
  for (let i = 0; i < items.length; i += 2) rows.push(items.slice(i, i + 2));
  return rows;
}

/** The homeowner's quotation: prices only, never costs or margins. */
export function QuoteDocument({ model }: { model: QuotePdfModel }) {
  const { firm, quote, customer, site } = model;
  return (
    <Document
      title={`Quotation ${quote.reference} – ${firm.name}`}
      author={firm.name}
      subject={`Quotation for ${customer.name}`}
      creator="Gloaming"
      producer="Gloaming"
    >
      {/*
        react-pdf's newer pagination engine (experimentalPagination): the quote's page splitting
        was most of its render time. The footer is the page's layout (that engine's page chrome),
        drawn on every page with its own number and the total. The installer's pack stays on
        the default engine.
      */}
      <Page
        size="A4"
        style={s.page}
        experimentalPagination
        layout={({ children, pageNumber, totalPages }) => (
          <>
            {children}
            <View style={s.footer}>
              <Text>
                {firm.name} · {quote.reference}
              </Text>
              <Text>{`Page ${pageNumber ?? 1} of ${totalPages ?? '…'}`}</Text>
            </View>
          </>
        )}
      >
        <View style={s.header}>
          <View>
            {firm.logo ? (
              <Image style={s.logo} src={{ data: Buffer.from(firm.logo.bytes), format: firm.logo.format }} />
            ) : (
              <Text style={s.firmName}>{firm.name}</Text>
            )}
            <Text style={s.firmLines}>{firm.addressLines.join(' · ')}</Text>
            {firm.vatNumber ? <Text style={s.firmLines}>VAT registration {firm.vatNumber}</Text> : null}
          </View>
          <View style={s.docTitleBlock}>
            <Text style={s.docTitle}>Quotation</Text>
            <Text style={s.docRef}>
              {quote.reference} · revision {quote.revision}
            </Text>
          </View>
        </View>
        <View style={s.accent} />

        <View style={s.parties}>
          <View style={s.party}>
            <Text style={s.label}>Prepared for</Text>
            <Text style={s.strong}>{customer.name}</Text>
            {site ? site.addressLines.map((l, i) => <Text key={i}>{l}</Text>) : null}
            {customer.email ? <Text style={s.detailKey}>{customer.email}</Text> : null}
            {customer.phone ? <Text style={s.detailKey}>{customer.phone}</Text> : null}
          </View>
          <View style={s.party}>
            <Text style={s.label}>{quote.title || 'Garden lighting'}</Text>
            <View style={s.detailRow}>
              <Text style={s.detailKey}>Reference</Text>
              <Text>{quote.reference}</Text>
            </View>
            <View style={s.detailRow}>
              <Text style={s.detailKey}>Date</Text>
              <Text>{quote.issuedOn}</Text>
            </View>
            <View style={s.detailRow}>
              <Text style={s.detailKey}>Valid until</Text>
              <Text style={s.strong}>{quote.validUntil}</Text>
            </View>
            {quote.preparedBy ? (
              <View style={s.detailRow}>
                <Text style={s.detailKey}>Prepared by</Text>
                <Text>{quote.preparedBy}</Text>
              </View>
            ) : null}
            {site?.label ? (
              <View style={s.detailRow}>
                <Text style={s.detailKey}>Site</Text>
                <Text>{site.label}</Text>
              </View>
            ) : null}
          </View>
        </View>

        {model.introduction ? <Text style={s.intro}>{model.introduction}</Text> : null}

        <View style={s.sections}>
          {model.sections.map((section, i) => (
            <Section key={i} section={section} />
          ))}
        </View>

        <View style={s.totalsWrap} wrap={false}>
          <View style={s.totals}>
            {model.totals.map((row, i) =>
              row.strong ? (
                <View key={i} style={s.grandRow}>
                  <Text style={s.grand}>{row.label}</Text>
                  <Text style={s.grand}>{row.amount}</Text>
                </View>
              ) : (
                <View key={i} style={s.totalRow}>
                  <Text style={s.detailKey}>{row.label}</Text>
                  <Text>{row.amount}</Text>
                </View>
              ),
            )}
            {model.deposit ? (
              <View style={s.depositBox}>
                <View style={s.totalRow}>
                  <Text style={s.strong}>Deposit</Text>
                  <Text style={s.strong}>{model.deposit.deposit}</Text>
                </View>
                <View style={s.totalRow}>
                  <Text style={s.detailKey}>Balance on completion</Text>
                  <Text>{model.deposit.balance}</Text>
                </View>
                <Text style={s.small}>{model.deposit.note}</Text>
              </View>
            ) : null}
          </View>
        </View>
        {model.choicesNote ? <Text style={[s.small, { marginTop: 8 }]}>{model.choicesNote}</Text> : null}

        {/* top-level, not the first child of a block: only there does minPresenceAhead hold (see Section) */}
        <Text style={[s.blockTitle, s.block]} minPresenceAhead={30}>
          Terms
        </Text>
        <Text style={s.para}>{model.terms || `This quotation is valid until ${quote.validUntil}.`}</Text>
        <Text style={s.safety} wrap={false}>
          {model.safetyNote}
        </Text>

        {model.photos.length > 0 ? (
          <View break>
            <Text style={[s.sectionName, { marginBottom: 8 }]}>Your garden: photos and plans</Text>
            {pairs(model.photos).map((pair, i) => (
              <View key={i} style={s.photoRow} wrap={false}>
                {pair.map((p, j) => (
                  <View key={j} style={s.photo}>
                    <Image style={s.photoImage} src={{ data: Buffer.from(p.jpeg), format: 'jpg' }} />
                    {p.caption ? <Text style={s.caption}>{p.caption}</Text> : null}
                  </View>
                ))}
              </View>
            ))}
          </View>
        ) : null}
      </Page>
    </Document>
  );
}
