/**
 * The reportable-range study's words (table cells, sentences, the verdict headline) live beside its engine in
 * shared/stats/reportable-range-words.ts, because the engine writes its verdict sentence with them and the
 * statistics never import a kind's folder. The kind's screens, PDF and workbook import them from here.
 */
export * from '../../stats/reportable-range-words';
