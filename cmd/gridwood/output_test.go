package main

import (
	"bytes"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"

	"github.com/gridwood/gridwood/dotio"
)

// The tests of output.go. Most run the test binary as the command in a
// shell (runMainEnv), since what they check is what a shell does with the
// process's descriptors: >> into a file, a closed descriptor, a umask, a
// full device, a pipe whose reader leaves. A shell is common practice on
// every Unix; they are skipped without /bin/sh.

const k5Text = "graph K5 { a -- b -- c -- d -- e -- a -- c -- e -- b -- d -- a }\n"

// inShell runs script with sh in dir, $G standing for the command; it
// returns the exit status, standard output and standard error.
func inShell(t *testing.T, dir, script string) (int, string, string) {
	t.Helper()
	if _, err := os.Stat("/bin/sh"); err != nil {
		t.Skip("no /bin/sh:", err)
	}
	cmd := exec.Command("/bin/sh", "-c", script)
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), runMainEnv+"=1", "G="+os.Args[0])
	var out, errs bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errs
	err := cmd.Run()
	if cmd.ProcessState == nil {
		t.Fatalf("sh: %v", err)
	}
	return cmd.ProcessState.ExitCode(), out.String(), errs.String()
}

// writeFiles creates files in dir from name-content pairs.
func writeFiles(t *testing.T, dir string, files ...string) {
	t.Helper()
	for i := 0; i+1 < len(files); i += 2 {
		if err := os.WriteFile(filepath.Join(dir, files[i]), []byte(files[i+1]), 0o644); err != nil {
			t.Fatal(err)
		}
	}
}

// leftovers lists the temporary files in dir.
func leftovers(t *testing.T, dir string) []string {
	t.Helper()
	entries, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	var tmp []string
	for _, e := range entries {
		if strings.Contains(e.Name(), tempMark) {
			tmp = append(tmp, e.Name())
		}
	}
	return tmp
}

// TestRedirectedStdoutKept: an output path that is the file behind
// standard output is written through the descriptor, never renamed over
// it: a log appended to with >> keeps what it held (the issue's
// `--report /dev/stdout ... >> build.log`), lines a shell writes around
// the run stay in order, and the same holds for /dev/fd/1, /proc/self/fd/1,
// a link to /dev/stdout, the file's own name, and standard error.
func TestRedirectedStdoutKept(t *testing.T) {
	dir := t.TempDir()
	writeFiles(t, dir, "mid.dot", k5Text, "x.dot", "graph { a -- b }\n")
	if err := os.Symlink("/dev/stdout", filepath.Join(dir, "out-link")); err != nil {
		t.Fatal(err)
	}
	laid := func(name string) string {
		_, out, _ := runCmd(t, string(mustRead(t, filepath.Join(dir, name))), "-q")
		return out
	}
	x := laid("x.dot")
	for _, tc := range []struct {
		name, script, want string
	}{
		{"report appended to a log", `printf 'old line\n' > build.log; "$G" -q --report /dev/stdout mid.dot -o /dev/null >> build.log`, "old line\n{\n  \"files\": ["},
		{"shell lines around", `( echo before; "$G" -q -o /dev/stdout x.dot; echo after ) > build.log`, "before\n" + x + "after\n"},
		{"/dev/fd/1", `( echo before; "$G" -q -o /dev/fd/1 x.dot; echo after ) > build.log`, "before\n" + x + "after\n"},
		{"/proc/self/fd/1", `( echo before; "$G" -q -o /proc/self/fd/1 x.dot; echo after ) > build.log`, "before\n" + x + "after\n"},
		{"a link to /dev/stdout", `echo before > build.log; "$G" -q -o out-link x.dot >> build.log`, "before\n" + x},
		{"the log by name", `echo before > build.log; "$G" -q -o build.log x.dot >> build.log`, "before\n" + x},
		{"standard error", `echo before > build.log; "$G" -q -o /dev/stderr x.dot 2>> build.log`, "before\n" + x},
		{"main output then the report", `echo before > build.log; "$G" -q --report /dev/fd/1 x.dot >> build.log`, "before\n" + x + "{\n  \"files\": ["},
	} {
		t.Run(tc.name, func(t *testing.T) {
			code, out, errs := inShell(t, dir, tc.script)
			if code != exitOK || out != "" || errs != "" {
				t.Fatalf("exit %d, stdout %q, stderr %q", code, out, errs)
			}
			log := string(mustRead(t, filepath.Join(dir, "build.log")))
			if !strings.HasPrefix(log, tc.want) {
				t.Errorf("build.log:\n%s\nwant it to start with\n%s", log, tc.want)
			}
			if fi, err := os.Lstat(filepath.Join(dir, "out-link")); err != nil || fi.Mode()&os.ModeSymlink == 0 {
				t.Errorf("the link to /dev/stdout was replaced: %v", err)
			}
			if tmp := leftovers(t, dir); len(tmp) > 0 {
				t.Errorf("temporary files left: %v", tmp)
			}
		})
	}
}

func mustRead(t *testing.T, path string) []byte {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// TestSideFilesWaitForStdout: standard output is written before any side
// file is renamed into place, so a run whose standard output fails (the
// full device /dev/full, which fails every write with ENOSPC: common
// practice on Linux) leaves the side files as they were, new ones not
// created, and no temporary file behind.
func TestSideFilesWaitForStdout(t *testing.T) {
	if _, err := os.Stat("/dev/full"); err != nil {
		t.Skip("no /dev/full:", err)
	}
	dir := t.TempDir()
	writeFiles(t, dir, "mid.dot", k5Text, "s.svg", "old picture\n")
	code, out, errs := inShell(t, dir, `"$G" -q --removed r.dot --svg s.svg --report rep.json mid.dot >/dev/full`)
	if code != exitBadInput || out != "" || errs != "gridwood: standard output: cannot write: no space left on device\n" {
		t.Fatalf("exit %d, stdout %q, stderr %q", code, out, errs)
	}
	if _, err := os.Stat(filepath.Join(dir, "r.dot")); !os.IsNotExist(err) {
		t.Errorf("r.dot exists after a failed run: %v", err)
	}
	if _, err := os.Stat(filepath.Join(dir, "rep.json")); !os.IsNotExist(err) {
		t.Errorf("rep.json exists after a failed run: %v", err)
	}
	if b := mustRead(t, filepath.Join(dir, "s.svg")); string(b) != "old picture\n" {
		t.Errorf("s.svg changed by a failed run: %q", b)
	}
	if tmp := leftovers(t, dir); len(tmp) > 0 {
		t.Errorf("temporary files left: %v", tmp)
	}
	// A side file that names standard output fails the same way.
	code, _, errs = inShell(t, dir, `"$G" -q --removed r.dot --report /dev/stdout -o out.dot mid.dot >/dev/full`)
	if code != exitBadInput || errs != "gridwood: /dev/stdout (standard output): cannot write: no space left on device\n" {
		t.Errorf("--report /dev/stdout on a full device: exit %d, stderr %q", code, errs)
	}
	for _, name := range []string{"r.dot", "out.dot"} {
		if _, err := os.Stat(filepath.Join(dir, name)); !os.IsNotExist(err) {
			t.Errorf("%s exists after a failed run: %v", name, err)
		}
	}
}

// bigDOT is a graph whose laid-out text is far larger than a pipe's buffer
// (64 KiB on Linux, from memory), with isolated nodes of long names so
// that the layout stays quick.
func bigDOT() string {
	var b strings.Builder
	b.WriteString("graph big {\n")
	for i := range 3000 {
		fmt.Fprintf(&b, "\tnode_%04d_with_a_long_name_to_fill_the_output\n", i)
	}
	b.WriteString("\tnode_0000_with_a_long_name_to_fill_the_output -- node_0001_with_a_long_name_to_fill_the_output\n}\n")
	return b.String()
}

// TestFillSmallDevice lays a graph out into a 64 KiB file system (a tmpfs
// mounted in a mount namespace of its own, which needs root and the
// unshare command; skipped otherwise): the temporary file runs out of
// space, the run exits 2 naming the file, and the old file and the side
// file are as they were, with no temporary file left.
func TestFillSmallDevice(t *testing.T) {
	if _, err := exec.LookPath("unshare"); err != nil {
		t.Skip("no unshare command")
	}
	dir := t.TempDir()
	writeFiles(t, dir, "big.dot", bigDOT())
	if err := os.Mkdir(filepath.Join(dir, "small"), 0o755); err != nil {
		t.Fatal(err)
	}
	// Inside the namespace: mount, put old files there, run, list what is
	// left, all before the namespace (and its mount) goes.
	script := `unshare -m /bin/sh -c '
		mount -t tmpfs -o size=64k tmpfs small || exit 99
		printf "old\n" > small/out.dot; printf "old removed\n" > small/r.dot
		"$G" -q --removed small/r.dot -o small/out.dot big.dot; echo "exit $?"
		cat small/out.dot small/r.dot; ls -a small'`
	code, out, errs := inShell(t, dir, script)
	if code == 99 || strings.Contains(errs, "unshare:") || strings.Contains(errs, "mount:") {
		t.Skipf("cannot mount a small file system here: %s", errs)
	}
	want := "exit 2\nold\nold removed\n.\n..\nout.dot\nr.dot\n"
	if out != want || !strings.Contains(errs, "gridwood: small/out.dot: cannot write: no space left on device") {
		t.Errorf("stdout\n%s\nwant\n%s\nstderr %q", out, want, errs)
	}
}

// TestClosedStdout: a run whose standard output is closed (>&-) fails at
// once with exit status 2 and writes nothing, instead of laying out into
// the null device the runtime puts in its place; with -o it needs no
// standard output and runs.
func TestClosedStdout(t *testing.T) {
	dir := t.TempDir()
	writeFiles(t, dir, "mid.dot", k5Text)
	code, out, errs := inShell(t, dir, `"$G" -q --removed r.dot mid.dot >&-`)
	if code != exitBadInput || out != "" || !strings.HasPrefix(errs, "gridwood: standard output is closed") || strings.Count(errs, "\n") != 1 {
		t.Errorf("closed stdout: exit %d, stdout %q, stderr %q", code, out, errs)
	}
	if _, err := os.Stat(filepath.Join(dir, "r.dot")); !os.IsNotExist(err) {
		t.Errorf("r.dot written although standard output was closed: %v", err)
	}
	for _, args := range []string{"--version", "--report /dev/stdout -o out.dot mid.dot"} {
		if code, _, errs := inShell(t, dir, `"$G" -q `+args+` >&-`); code != exitBadInput || !strings.Contains(errs, "standard output is closed") {
			t.Errorf("%s with stdout closed: exit %d, stderr %q", args, code, errs)
		}
	}
	for _, script := range []string{`"$G" -q --removed r.dot -o out.dot mid.dot >&-`, `"$G" -q --removed r.dot mid.dot >/dev/null`, `"$G" -q -o /dev/null mid.dot >&-`} {
		if code, _, errs := inShell(t, dir, script); code != exitOK || errs != "" {
			t.Errorf("%s: exit %d, stderr %q", script, code, errs)
		}
	}
	if _, err := os.Stat(filepath.Join(dir, "r.dot")); err != nil {
		t.Errorf("r.dot not written by the runs that need no standard output: %v", err)
	}
}

// TestNewFilesFollowUmask: a new output file gets mode 0666 less the
// umask, as any file a program creates (POSIX open with O_CREAT); a file
// that is replaced keeps its mode.
func TestNewFilesFollowUmask(t *testing.T) {
	dir := t.TempDir()
	writeFiles(t, dir, "x.dot", "graph { a -- b }\n", "kept.dot", "old\n")
	if err := os.Chmod(filepath.Join(dir, "kept.dot"), 0o640); err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		umask string
		want  os.FileMode
	}{{"077", 0o600}, {"022", 0o644}, {"002", 0o664}} {
		name := "new-" + tc.umask + ".dot"
		code, _, errs := inShell(t, dir, `umask `+tc.umask+`; "$G" -q -o `+name+` --svg `+name+`.svg --report kept.dot x.dot`)
		if code != exitOK {
			t.Fatalf("umask %s: exit %d: %s", tc.umask, code, errs)
		}
		for _, f := range []string{name, name + ".svg"} {
			fi, err := os.Stat(filepath.Join(dir, f))
			if err != nil || fi.Mode().Perm() != tc.want {
				t.Errorf("umask %s: %s has mode %v, want %v (%v)", tc.umask, f, fi.Mode().Perm(), tc.want, err)
			}
		}
		if fi, err := os.Stat(filepath.Join(dir, "kept.dot")); err != nil || fi.Mode().Perm() != 0o640 {
			t.Errorf("umask %s: the replaced file's mode became %v, want 0640", tc.umask, fi.Mode().Perm())
		}
	}
}

// TestBrokenPipe: a reader that stops early (head) ends the run by
// SIGPIPE, as any filter in a pipeline, and the side files are not
// written, nor is any temporary file left. The output is larger than a
// pipe's buffer so that the write does meet the closed pipe.
func TestBrokenPipe(t *testing.T) {
	dir := t.TempDir()
	writeFiles(t, dir, "big.dot", bigDOT())
	cmd := exec.Command(os.Args[0], "-q", "--svg", "s.svg", "--removed", "r.dot", "big.dot")
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), runMainEnv+"=1")
	stdout, err := cmd.StdoutPipe()
	if err != nil {
		t.Fatal(err)
	}
	var errs bytes.Buffer
	cmd.Stderr = &errs
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	head := make([]byte, 10)
	if _, err := io.ReadFull(stdout, head); err != nil {
		t.Fatal(err)
	}
	stdout.Close()
	cmd.Wait()
	ws, ok := cmd.ProcessState.Sys().(syscall.WaitStatus)
	if !ok || !ws.Signaled() || ws.Signal() != syscall.SIGPIPE {
		t.Errorf("%s, stderr %q; want death by SIGPIPE (exit status 141 in a shell)", cmd.ProcessState, errs.String())
	}
	if string(head) != "graph big " {
		t.Errorf("the reader got %q", head)
	}
	for _, name := range []string{"s.svg", "r.dot"} {
		if _, err := os.Stat(filepath.Join(dir, name)); !os.IsNotExist(err) {
			t.Errorf("%s written although standard output failed: %v", name, err)
		}
	}
	if tmp := leftovers(t, dir); len(tmp) > 0 {
		t.Errorf("temporary files left: %v", tmp)
	}
	// A caller that ignores SIGPIPE changes nothing: the Go runtime keeps
	// an inherited SIG_IGN only for SIGHUP and SIGINT (os/signal's
	// documentation), so the run ends the same way.
	code, _, stderr := inShell(t, dir, `trap '' PIPE; { "$G" -q --svg s.svg big.dot; echo "exit $?" >&2; } | head -c 10 >/dev/null`)
	if code != exitOK || stderr != "exit 141\n" {
		t.Errorf("SIGPIPE ignored by the caller: sh exit %d, stderr %q", code, stderr)
	}
	if _, err := os.Stat(filepath.Join(dir, "s.svg")); !os.IsNotExist(err) {
		t.Errorf("s.svg written although standard output failed: %v", err)
	}
}

// TestTemporaryFileNames: a temporary file is hidden beside its file and
// says what it is and which process made it; a second one for the same
// file gets a number of its own, and a long name is cut to stay within
// the usual 255-byte limit.
func TestTemporaryFileNames(t *testing.T) {
	dir := t.TempDir()
	target := filepath.Join(dir, "out.dot")
	want := fmt.Sprintf(".out.dot%s%d", tempMark, os.Getpid())
	f1, err := createTemp(target, 0o600)
	if err != nil {
		t.Fatal(err)
	}
	defer f1.Close()
	f2, err := createTemp(target, 0o600)
	if err != nil {
		t.Fatal(err)
	}
	defer f2.Close()
	if got := filepath.Base(f1.Name()); got != want {
		t.Errorf("temporary file %q, want %q", got, want)
	}
	if got := filepath.Base(f2.Name()); got != want+"-2" {
		t.Errorf("second temporary file %q, want %q", got, want+"-2")
	}
	long := filepath.Join(dir, strings.Repeat("n", 250))
	f3, err := createTemp(long, 0o600)
	if err != nil {
		t.Fatalf("a 250-byte name: %v", err)
	}
	f3.Close()
	if n := len(filepath.Base(f3.Name())); n > 255 {
		t.Errorf("temporary name of %d bytes", n)
	}
}

// TestDescriptorNames checks which paths count as naming a descriptor:
// the /dev names, /dev/fd and /proc/self/fd (and this process's own
// /proc/PID/fd), also through a link; not a file that merely looks alike.
func TestDescriptorNames(t *testing.T) {
	dir := t.TempDir()
	if err := os.Symlink("/dev/stdout", filepath.Join(dir, "link")); err != nil {
		t.Fatal(err)
	}
	writeFiles(t, dir, "1", "not a descriptor\n")
	for _, tc := range []struct {
		path string
		fd   int
		ok   bool
	}{
		{"/dev/stdin", 0, true}, {"/dev/stdout", 1, true}, {"/dev/stderr", 2, true},
		{"/dev/fd/1", 1, true}, {"/dev/fd/7", 7, true}, {"/proc/self/fd/2", 2, true},
		{fmt.Sprintf("/proc/%d/fd/1", os.Getpid()), 1, true}, {"/proc/1/fd/1", 0, false},
		{filepath.Join(dir, "link"), 1, true}, {filepath.Join(dir, "1"), 0, false},
		{"/dev/fd/01", 0, false}, {"/dev/null", 0, false},
	} {
		fd, ok := descriptorNamed(tc.path)
		if fd != tc.fd || ok != tc.ok {
			t.Errorf("%s: %d %v, want %d %v", tc.path, fd, ok, tc.fd, tc.ok)
		}
	}
}

// TestStdinIsAlsoInput: an output that is the file standard input reads,
// when standard input is an input, is refused like any output that names
// an input, and so is standard output appended to an input file.
func TestStdinIsAlsoInput(t *testing.T) {
	dir := t.TempDir()
	writeFiles(t, dir, "x.dot", "graph { a -- b }\n")
	code, _, errs := inShell(t, dir, `"$G" -q -o x.dot < x.dot`)
	if code != exitBadInput || errs != "gridwood: -o x.dot is also the input (standard input) (see gridwood --help)\n" {
		t.Errorf("-o x.dot < x.dot: exit %d, stderr %q", code, errs)
	}
	code, _, errs = inShell(t, dir, `"$G" -q x.dot >> x.dot`)
	if code != exitBadInput || errs != "gridwood: standard output is the input file x.dot (see gridwood --help)\n" {
		t.Errorf("x.dot >> x.dot: exit %d, stderr %q", code, errs)
	}
	if b := mustRead(t, filepath.Join(dir, "x.dot")); string(b) != "graph { a -- b }\n" {
		t.Errorf("x.dot changed: %q", b)
	}
	// Standard input not read (an input file named): writing over the
	// file behind it is what was asked.
	writeFiles(t, dir, "y.dot", "graph { c -- d }\n")
	if code, _, errs := inShell(t, dir, `"$G" -q -o y.dot x.dot < y.dot`); code != exitOK {
		t.Errorf("-o y.dot x.dot < y.dot: exit %d, %s", code, errs)
	}
	if f, err := dotio.Read(mustRead(t, filepath.Join(dir, "y.dot")), dotio.ReadOptions{Name: "y.dot"}); err != nil || f.Graphs[0].Nodes[0].Name != "a" {
		t.Errorf("y.dot does not hold x.dot laid out: %v", err)
	}
}

// TestStoppedWhileCommitting: a run stopped by SIGTERM while it commits
// its outputs removes its temporary files and ends by that signal,
// leaving every output as it was. A named pipe as one output holds the
// run in the commit (opening a pipe waits for a reader) after the
// temporary files are written.
func TestStoppedWhileCommitting(t *testing.T) {
	dir := t.TempDir()
	writeFiles(t, dir, "x.dot", "graph { a -- b }\n", "out.dot", "old\n")
	pipe := filepath.Join(dir, "pipe")
	if err := syscall.Mkfifo(pipe, 0o600); err != nil {
		t.Skip("no named pipes here:", err)
	}
	cmd := exec.Command(os.Args[0], "-q", "--removed", pipe, "--svg", "s.svg", "-o", "out.dot", "x.dot")
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), runMainEnv+"=1")
	var errs bytes.Buffer
	cmd.Stderr = &errs
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	// Wait (up to 20 s, polling) for both temporary files.
	for i := 0; len(leftovers(t, dir)) < 2; i++ {
		if i == 2000 {
			cmd.Process.Kill()
			cmd.Wait()
			t.Fatalf("no temporary files after 20 s: %v; stderr %q", leftovers(t, dir), errs.String())
		}
		time.Sleep(10 * time.Millisecond)
	}
	cmd.Process.Signal(syscall.SIGTERM)
	cmd.Wait()
	ws, ok := cmd.ProcessState.Sys().(syscall.WaitStatus)
	if !ok || !ws.Signaled() || ws.Signal() != syscall.SIGTERM {
		t.Errorf("%s, stderr %q; want death by SIGTERM", cmd.ProcessState, errs.String())
	}
	if tmp := leftovers(t, dir); len(tmp) > 0 {
		t.Errorf("temporary files left: %v", tmp)
	}
	if b := mustRead(t, filepath.Join(dir, "out.dot")); string(b) != "old\n" {
		t.Errorf("out.dot changed: %q", b)
	}
	if _, err := os.Stat(filepath.Join(dir, "s.svg")); !os.IsNotExist(err) {
		t.Errorf("s.svg written by a stopped run: %v", err)
	}
}
