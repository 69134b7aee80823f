// Package nodesize gives each node of a DOT graph its box in points, from
// the node's DOT attributes, and lays out what its label holds: text
// lines, record fields, or an HTML-like table. The layout spaces nodes by
// these boxes, the SVG preview draws them, and --check judges drawings
// by them, so all three agree. It knows no layout algorithm and no
// drawing format.
//
// # The box rule
//
// The rules follow the DOT language's documentation (recalled from
// memory; SOURCES.md lists each with its standing). In short:
//
//   - width and height are in inches (defaults 0.75 and 0.5) and are
//     minimums; the box grows to hold the label with its margin (default
//     8 points left and right, 4 above and below, DOT's 0.11 x 0.055 inch
//     rounded to whole points) unless fixedsize=true. fixedsize=shape
//     keeps the outline at width x height but the box still holds the
//     label. A width, height or fontsize that is not a number from 0 to
//     below 1000 counts as unset (SizeTaken).
//   - The label must fit inside the outline: an ellipse needs about 1.41
//     times the label's box, a diamond twice it, and so on for every
//     shape of the catalog (Shapes), with the height given first and the
//     width solved for it, as DOT does for ellipses.
//   - circle, doublecircle, point and square are as wide as tall: width
//     alone, height alone, or the larger of the two when both are given
//     set the size; with neither, the smaller default (0.5 inch) does, and
//     a point is 0.05 inch and shows no label.
//   - peripheries (default 1, doublecircle and doubleoctagon 2,
//     tripleoctagon 3, plaintext and none 0) add 4 points a side per ring
//     beyond the first.
//   - A label line is 0.6 em per character and 1.2 em high (common
//     practice for proportional fonts), at fontsize (default 14 points).
//     Escapes: \n, \l, \r end a line centred, left or right; \N is the
//     node's name, \G the graph's; an edge label also knows \E, \T, \H.
//     An unset label is \N; label="" is empty.
//   - A record or Mrecord label is fields: | separates, {} flips between
//     across and down (across at the top, down when rankdir is LR or RL),
//     <port> names a field, \{ \} \| \< \> and "\ " are literal, blanks
//     collapse. Each field holds its text with the margin; the fields fill
//     the record's box, extra room shared equally.
//   - An HTML-like label holds text (B, I, U, S, FONT, BR) or a TABLE of
//     TR and TD (COLSPAN, ROWSPAN, BORDER, CELLBORDER, CELLPADDING,
//     CELLSPACING, WIDTH, HEIGHT, FIXEDSIZE, ALIGN, VALIGN, BALIGN,
//     BGCOLOR, COLOR; nested tables); defaults BORDER 1, CELLBORDER the
//     table's BORDER, CELLPADDING 2, CELLSPACING 2.
//   - No side is over MaxSide (1000 inches); a node whose label needs
//     more is capped and marked.
//
// A node without a shape is drawn by the preview in its own look (a
// rounded box); it is sized as a box. What a label holds that this package
// does not lay out (an IMG, a rule, an unknown attribute) is listed in
// Label.Notes, so that the preview can say so.
package nodesize
