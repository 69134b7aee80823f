package main

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"os/signal"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"sync"
	"syscall"
	"time"
)

// Output files (README.md, "Output files").
//
// Nothing is written until every input was read and laid out. Then every
// output is committed in this order, so that a failure at any step leaves
// every file as it was and a reader never sees half a file:
//
//  1. files to be replaced (regular files and new ones) are written to
//     temporary files next to them;
//  2. standard output gets the laid-out DOT and any output whose path is
//     the file behind it, through the descriptor (never renamed over: a
//     shell's >> file or a pipe stays what it is); then standard error;
//  3. outputs that exist and are not regular files (a named pipe, a
//     device), or that name another descriptor (/dev/fd/N), are opened and
//     written;
//  4. the temporary files are renamed into place, the main output last.
//
// A temporary file is named .NAME.gridwood-tmp-PID beside NAME; it is
// removed on every failure and when the run is stopped by SIGINT, SIGTERM
// or SIGHUP while committing; only a run killed outright (SIGKILL, a power
// cut) can leave one behind.

// targetKind is how an output reaches its file.
type targetKind uint8

const (
	toReplace targetKind = iota // a regular or new file: a temporary file renamed over it
	toStdout                    // the file behind standard output: written through the descriptor
	toStderr                    // the same for standard error
	toDirect                    // not a regular file, or named by a descriptor: opened and written
)

// output is one output of the run: where it goes and, once the run is
// done, what it holds.
type output struct {
	flag string // the flag that named it ("-o", "--svg", ...); "" for standard output
	path string // as given
	kind targetKind
	// file is the file a toReplace output replaces or creates (symbolic
	// links followed, so the links stay); appendTo opens a toDirect output
	// to append (a regular file behind a descriptor name, which the
	// caller opened, keeps what it holds).
	file     string
	appendTo bool
	data     []byte
}

// stdStreams are the standard streams run was given, with what is known
// of the files behind them (nil info when they are no files, as in tests).
type stdStreams struct {
	in               io.Reader
	out, err         io.Writer
	inInfo           os.FileInfo
	outInfo, errInfo os.FileInfo
}

func newStdStreams(stdin io.Reader, stdout, stderr io.Writer) *stdStreams {
	s := &stdStreams{in: stdin, out: stdout, err: stderr}
	info := func(v any) os.FileInfo {
		if f, ok := v.(*os.File); ok && f != nil {
			if fi, err := f.Stat(); err == nil {
				return fi
			}
		}
		return nil
	}
	s.inInfo, s.outInfo, s.errInfo = info(stdin), info(stdout), info(stderr)
	return s
}

// sameStream reports whether fi, a file an output path resolves to, is
// the file behind a standard stream (stream). Terminals and the null
// device are left out: opening them again writes to the same place, and
// /dev/null given as an output while standard output is the null device
// must not count as a use of standard output.
func sameStream(fi, stream os.FileInfo) bool {
	return fi != nil && stream != nil && stream.Mode()&os.ModeCharDevice == 0 && os.SameFile(fi, stream)
}

// planOutput decides how the output named by flag at path is written.
func planOutput(flag, path string, std *stdStreams) *output {
	o := &output{flag: flag, path: path}
	fd, named := descriptorNamed(path)
	fi, statErr := os.Stat(path)
	if statErr != nil {
		fi = nil
	}
	switch {
	case named && fd == 1, !named && sameStream(fi, std.outInfo):
		o.kind = toStdout
	case named && fd == 2, !named && sameStream(fi, std.errInfo):
		o.kind = toStderr
	case named:
		o.kind = toDirect
		o.appendTo = fi != nil && fi.Mode().IsRegular()
	case fi != nil && !fi.Mode().IsRegular():
		o.kind = toDirect
	default:
		o.kind = toReplace
		o.file = followLinks(path)
	}
	return o
}

// descriptorNamed reports whether path, or a symbolic link on the way
// from it, names an open file descriptor rather than a file: /dev/stdin,
// /dev/stdout, /dev/stderr, /dev/fd/N, /proc/self/fd/N (also
// /proc/thread-self and /proc/PID with this process's ID). Such a name is
// a link to whatever the descriptor is open on; renaming a file over it
// would replace the caller's file instead of writing where the caller
// points.
func descriptorNamed(path string) (fd int, ok bool) {
	for range 40 { // the usual system limit on links followed
		abs, err := filepath.Abs(path)
		if err != nil {
			return 0, false
		}
		if fd, ok := descriptorPath(abs); ok {
			return fd, true
		}
		fi, err := os.Lstat(abs)
		if err != nil || fi.Mode()&os.ModeSymlink == 0 {
			return 0, false
		}
		target, err := os.Readlink(abs)
		if err != nil {
			return 0, false
		}
		if !filepath.IsAbs(target) {
			target = filepath.Join(filepath.Dir(abs), target)
		}
		path = target
	}
	return 0, false
}

// descriptorPath recognises the names of descriptor links in a clean
// absolute path.
func descriptorPath(abs string) (int, bool) {
	switch abs {
	case "/dev/stdin":
		return 0, true
	case "/dev/stdout":
		return 1, true
	case "/dev/stderr":
		return 2, true
	}
	dir, num := filepath.Split(abs)
	n, err := strconv.Atoi(num)
	if err != nil || n < 0 || num != strconv.Itoa(n) {
		return 0, false
	}
	switch dir {
	case "/dev/fd/", "/proc/self/fd/", "/proc/thread-self/fd/", "/proc/" + strconv.Itoa(os.Getpid()) + "/fd/":
		return n, true
	}
	return 0, false
}

// followLinks returns the file a chain of symbolic links ends at, even
// when that file does not exist yet (a dangling link gets its file
// created), or path itself if it is not a link.
func followLinks(path string) string {
	for range 40 { // the usual system limit on links followed
		fi, err := os.Lstat(path)
		if err != nil || fi.Mode()&os.ModeSymlink == 0 {
			return path
		}
		target, err := os.Readlink(path)
		if err != nil {
			return path
		}
		if !filepath.IsAbs(target) {
			target = filepath.Join(filepath.Dir(path), target)
		}
		path = target
	}
	return path
}

// stdoutClosed reports whether standard output was closed when the
// command started. The Go runtime opens the null device, for reading and
// writing, on a standard descriptor it finds closed, before any of our
// code runs; a shell's >/dev/null opens it for writing only. So the null
// device opened for reading and writing is taken as closed (a caller that
// opens it that way on purpose, as Python's subprocess.DEVNULL does, is
// told to use -o /dev/null). Only Linux shows the access mode
// (/proc/self/fdinfo); elsewhere nothing is taken as closed.
func stdoutClosed(std *stdStreams) bool {
	f, ok := std.out.(*os.File)
	if !ok || f == nil || std.outInfo == nil || !isNullDevice(std.outInfo) {
		return false
	}
	info, err := os.ReadFile("/proc/self/fdinfo/" + strconv.FormatUint(uint64(f.Fd()), 10))
	if err != nil {
		return false
	}
	for _, line := range strings.Split(string(info), "\n") {
		if v, ok := strings.CutPrefix(line, "flags:"); ok {
			// Linux's access mode bits: O_ACCMODE 3, O_RDWR 2.
			flags, err := strconv.ParseUint(strings.TrimSpace(v), 8, 64)
			return err == nil && flags&3 == 2
		}
	}
	return false
}

// tempMark is in every temporary file's name: .NAME.gridwood-tmp-PID.
const tempMark = ".gridwood-tmp-"

// createTemp creates the temporary file for an output that replaces or
// creates file: hidden, beside it, named for what it is and for the
// process that made it. A new file is created with mode 0666 less the
// umask (as any new file); one that replaces a file is created 0600 and
// given the old file's mode once written.
func createTemp(file string, perm os.FileMode) (*os.File, error) {
	dir, base := filepath.Split(file)
	if len(base) > 200 { // keep the name within NAME_MAX (255)
		base = base[:200]
	}
	name := filepath.Join(dir, "."+base+tempMark+strconv.Itoa(os.Getpid()))
	for k := 1; ; k++ {
		try := name
		if k > 1 {
			try = name + "-" + strconv.Itoa(k)
		}
		f, err := os.OpenFile(try, os.O_WRONLY|os.O_CREATE|os.O_EXCL, perm)
		if err == nil || !errors.Is(err, fs.ErrExist) || k == 1000 {
			return f, err
		}
	}
}

// brokenPipe is a write to standard output or standard error that found
// the reading end closed (EPIPE): the run ends as a filter in a pipeline
// does, killed by SIGPIPE (see run).
type brokenPipe struct{ stream io.Writer }

func (e *brokenPipe) Error() string { return "broken pipe" }

// commitOutputs writes every output as described at the top of this file.
// outs holds the side files in order and the main output last.
func commitOutputs(outs []*output, std *stdStreams) error {
	g := startCommitGuard()
	defer g.stop()
	// fail names the path the user gave, and the cause without the
	// operation's own wording.
	fail := func(o *output, err error) error {
		g.removeTemps()
		var pe *fs.PathError
		if errors.As(err, &pe) {
			err = pe.Err
		}
		where := o.path
		switch {
		case o.kind == toStdout && o.flag == "":
			where = "standard output"
		case o.kind == toStdout:
			where += " (standard output)"
		case o.kind == toStderr:
			where += " (standard error)"
		}
		return &exitError{exitBadInput, fmt.Sprintf("%s: cannot write: %v", where, err)}
	}
	// 1. Temporary files.
	temps := make([]string, len(outs))
	for i, o := range outs {
		if o.kind != toReplace {
			continue
		}
		perm, keep := os.FileMode(0o666), os.FileMode(0)
		if fi, err := os.Stat(o.file); err == nil {
			perm, keep = 0o600, fi.Mode().Perm() // the old mode, set once written
		}
		f, err := createTemp(o.file, perm)
		if err != nil {
			return fail(o, err)
		}
		temps[i] = f.Name()
		g.add(f.Name())
		_, err = f.Write(o.data)
		if cerr := f.Close(); err == nil {
			err = cerr
		}
		if err == nil && perm == 0o600 {
			err = os.Chmod(f.Name(), keep)
		}
		if err != nil {
			return fail(o, err)
		}
	}
	// 2. Standard output, the laid-out DOT first, then standard error.
	for _, stream := range []targetKind{toStdout, toStderr} {
		w := std.out
		if stream == toStderr {
			w = std.err
		}
		for _, o := range streamOrder(outs, stream) {
			if _, err := w.Write(o.data); err != nil {
				if errors.Is(err, syscall.EPIPE) {
					g.removeTemps()
					return &brokenPipe{w}
				}
				return fail(o, err)
			}
		}
	}
	// 3. Pipes, devices and descriptors named by path.
	for _, o := range outs {
		if o.kind != toDirect {
			continue
		}
		flags := os.O_WRONLY | os.O_TRUNC
		if o.appendTo {
			flags = os.O_WRONLY | os.O_APPEND
		}
		f, err := os.OpenFile(o.path, flags, 0)
		if err == nil {
			_, err = f.Write(o.data)
			if cerr := f.Close(); err == nil {
				err = cerr
			}
		}
		if err != nil {
			return fail(o, err)
		}
	}
	// 4. Renames, the main output last (it is last in outs).
	for i, o := range outs {
		if temps[i] == "" {
			continue
		}
		if err := g.rename(temps[i], o.file); err != nil {
			return fail(o, err)
		}
	}
	return nil
}

// streamOrder lists the outputs written to one standard stream: the main
// output (last in outs) first, then the others in order.
func streamOrder(outs []*output, stream targetKind) []*output {
	var list []*output
	if n := len(outs); n > 0 && outs[n-1].kind == stream {
		list = append(list, outs[n-1])
	}
	for _, o := range outs[:max(len(outs)-1, 0)] {
		if o.kind == stream {
			list = append(list, o)
		}
	}
	return list
}

// commitGuard keeps the list of temporary files not yet renamed, and
// removes them if the run is stopped by a signal while committing.
type commitGuard struct {
	mu    sync.Mutex
	temps map[string]bool
	sigs  chan os.Signal
	done  chan struct{}
}

// startCommitGuard watches SIGINT, SIGTERM and SIGHUP (those not ignored
// when the command started: a run under nohup stays deaf to SIGHUP), and
// SIGPIPE, so that a write to a closed pipe on standard output fails with
// EPIPE instead of killing the process before its temporary files are
// removed.
func startCommitGuard() *commitGuard {
	g := &commitGuard{temps: map[string]bool{}, sigs: make(chan os.Signal, 4), done: make(chan struct{})}
	var watch []os.Signal
	for _, s := range []os.Signal{syscall.SIGINT, syscall.SIGTERM, syscall.SIGHUP, syscall.SIGPIPE} {
		if !signal.Ignored(s) {
			watch = append(watch, s)
		}
	}
	signal.Notify(g.sigs, watch...)
	go g.watch()
	return g
}

func (g *commitGuard) watch() {
	for {
		select {
		case <-g.done:
			return
		case s := <-g.sigs:
			if s == syscall.SIGPIPE {
				continue // the write fails with EPIPE, handled there
			}
			g.mu.Lock() // held to the end: no rename after this
			for name := range g.temps {
				os.Remove(name)
			}
			signal.Reset(s)
			if p, err := os.FindProcess(os.Getpid()); err == nil {
				p.Signal(s) // the default action ends the process
			}
			time.Sleep(time.Second)
			code := 128 + 2
			if n, ok := s.(syscall.Signal); ok {
				code = 128 + int(n)
			}
			os.Exit(code)
		}
	}
}

func (g *commitGuard) add(name string) {
	g.mu.Lock()
	g.temps[name] = true
	g.mu.Unlock()
}

func (g *commitGuard) rename(temp, file string) error {
	g.mu.Lock()
	defer g.mu.Unlock()
	err := os.Rename(temp, file)
	if err == nil {
		delete(g.temps, temp)
	}
	return err
}

func (g *commitGuard) removeTemps() {
	g.mu.Lock()
	defer g.mu.Unlock()
	for name := range g.temps {
		os.Remove(name)
		delete(g.temps, name)
	}
}

func (g *commitGuard) stop() {
	signal.Stop(g.sigs)
	close(g.done)
}

// planOutputs decides where every output goes (output.go): the side files
// in a fixed order, the main output last.
func planOutputs(cfg *config, std *stdStreams) {
	cfg.outs = cfg.outs[:0]
	for _, o := range []struct{ flag, path string }{{"--report", cfg.reportFile}, {"--svg", cfg.svgFile}, {"--removed", cfg.removedFile}, {"--explain", cfg.explainFile}} {
		if o.path != "" {
			cfg.outs = append(cfg.outs, planOutput(o.flag, o.path, std))
		}
	}
	if cfg.output != "" {
		cfg.outs = append(cfg.outs, planOutput("-o", cfg.output, std))
	} else {
		cfg.outs = append(cfg.outs, &output{kind: toStdout})
	}
}

// checkClashes refuses a command line on which two outputs name the same
// path or would replace the same file, or an output would replace an
// input (standard input included, when it is read and is a file), or
// standard output, when written to, is an input file: one would overwrite
// the other.
func checkClashes(cfg *config, std *stdStreams) error {
	sameFile := func(a, b string) bool {
		fa, errA := os.Stat(a)
		fb, errB := os.Stat(b)
		return errA == nil && errB == nil && fa.Mode().IsRegular() && os.SameFile(fa, fb)
	}
	readsStdin := slices.Contains(cfg.inputs, "-")
	// In the order of --help: -o first.
	var named []*output
	if main := cfg.outs[len(cfg.outs)-1]; main.flag != "" {
		named = append(named, main)
	}
	named = append(named, cfg.outs[:len(cfg.outs)-1]...)
	for i, o := range named {
		for _, p := range named[:i] {
			if filepath.Clean(o.path) == filepath.Clean(p.path) || o.kind == toReplace && p.kind == toReplace && sameFile(o.file, p.file) {
				return fmt.Errorf("%s and %s both name %s", p.flag, o.flag, o.path)
			}
		}
		for _, in := range cfg.inputs {
			if in != "-" && (filepath.Clean(o.path) == filepath.Clean(in) || sameFile(o.path, in)) {
				return fmt.Errorf("%s %s is also an input file", o.flag, o.path)
			}
		}
		if fi, err := os.Stat(o.path); readsStdin && err == nil && fi.Mode().IsRegular() && std.inInfo != nil && os.SameFile(fi, std.inInfo) {
			return fmt.Errorf("%s %s is also the input (standard input)", o.flag, o.path)
		}
	}
	if std.outInfo != nil && std.outInfo.Mode().IsRegular() && slices.ContainsFunc(cfg.outs, func(o *output) bool { return o.kind == toStdout }) {
		for _, in := range cfg.inputs {
			if fi, err := os.Stat(in); in != "-" && err == nil && os.SameFile(fi, std.outInfo) {
				return fmt.Errorf("standard output is the input file %s", in)
			}
		}
	}
	return nil
}

// sideFile returns the planned output of a side-file flag.
func (cfg *config) sideFile(flag string) *output {
	for _, o := range cfg.outs {
		if o.flag == flag {
			return o
		}
	}
	return nil
}
