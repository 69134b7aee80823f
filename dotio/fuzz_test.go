package dotio

import (
	"bytes"
	"errors"
	"slices"
	"testing"
)

// FuzzRead checks that Read never panics, reports only *Error for bad
// input, and that whatever it accepts is written back to DOT that reads
// to the same graph, also with removed edges dropped or marked.
func FuzzRead(f *testing.F) {
	f.Fuzz(func(t *testing.T, src []byte) {
		f1, err := Read(src, ReadOptions{Name: "fuzz", MaxExpansion: 20_000})
		if err != nil {
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("Read: %v is not an *Error", err)
			}
			return
		}
		lays := synthLayout(f1)
		var out bytes.Buffer
		if err := Write(&out, f1, lays, WriteOptions{}); err != nil {
			t.Fatalf("Write: %v", err)
		}
		f2, err := Read(out.Bytes(), ReadOptions{Name: "out", MaxExpansion: -1})
		if err != nil {
			t.Fatalf("re-read: %v\ninput %q\noutput\n%s", err, src, out.Bytes())
		}
		if len(f2.Graphs) != len(f1.Graphs) {
			t.Fatalf("%d graphs, want %d", len(f2.Graphs), len(f1.Graphs))
		}
		for gi, g1 := range f1.Graphs {
			g2 := f2.Graphs[gi]
			if !slices.Equal(nodeNames(g1), nodeNames(g2)) || !slices.Equal(edgeNames(g1, nil), edgeNames(g2, nil)) {
				t.Fatalf("graph %d changed:\n%s\nwas\n%s\ninput %q\noutput\n%s", gi, dump(f2), dump(f1), src, out.Bytes())
			}
		}

		removed := removeEvery(f1, lays)
		for _, opt := range []WriteOptions{{DropRemoved: true}, {MarkRemoved: removedMark}} {
			out.Reset()
			if err := Write(&out, f1, lays, opt); err != nil {
				t.Fatalf("Write(%+v): %v", opt, err)
			}
			f3, err := Read(out.Bytes(), ReadOptions{Name: "out", MaxExpansion: -1})
			if err != nil {
				t.Fatalf("re-read (%+v): %v\ninput %q\noutput\n%s", opt, err, src, out.Bytes())
			}
			for gi, g1 := range f1.Graphs {
				g3 := f3.Graphs[gi]
				keep := func(i int) bool { return !opt.DropRemoved || !lays[gi].Removed[i] }
				if !slices.Equal(nodeNames(g1), nodeNames(g3)) || !slices.Equal(edgeNames(g1, keep), edgeNames(g3, nil)) {
					t.Fatalf("graph %d with %+v:\n%s\nwas\n%s\ninput %q\noutput\n%s", gi, opt, dump(f3), dump(f1), src, out.Bytes())
				}
			}
		}
		out.Reset()
		if err := WriteRemoved(&out, f1, removed); err != nil {
			t.Fatalf("WriteRemoved: %v", err)
		}
		if _, err := Read(out.Bytes(), ReadOptions{Name: "removed", MaxExpansion: -1}); err != nil {
			t.Fatalf("re-read removed: %v\n%s", err, out.Bytes())
		}
	})
}
