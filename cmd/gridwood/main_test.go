package main

import (
	"bytes"
	"fmt"
	"os"
	"os/exec"
	"runtime/debug"
	"testing"
)

// runMainEnv makes the test binary behave as the gridwood command: the
// determinism and hostile-input tests run it as a subprocess with this
// variable set, so that GOMAXPROCS, standard input and a fatal crash are
// those of a real process.
const runMainEnv = "GRIDWOOD_TEST_RUN_MAIN"

func TestMain(m *testing.M) {
	if os.Getenv(runMainEnv) == "1" {
		main() // exits
		os.Exit(0)
	}
	os.Exit(m.Run())
}

// runInProcess calls run and turns a panic into an error carrying the
// stack, so that a test or fuzz target can fail with it rather than die.
func runInProcess(stdin []byte, args ...string) (code int, stdout, stderr []byte, err error) {
	var out, errs bytes.Buffer
	func() {
		defer func() {
			if r := recover(); r != nil {
				err = fmt.Errorf("run panicked: %v\n%s", r, debug.Stack())
			}
		}()
		code = run(args, bytes.NewReader(stdin), &out, &errs)
	}()
	return code, out.Bytes(), errs.Bytes(), err
}

// subprocessResult is what a run of the command as a separate process gave.
type subprocessResult struct {
	code           int // -1 when the process did not exit normally
	stdout, stderr []byte
	state          string // os.ProcessState, for messages
}

// runSubprocess runs the test binary as the gridwood command with args,
// extra environment variables and the given standard input (nil: none).
func runSubprocess(t testing.TB, stdin []byte, env []string, args ...string) subprocessResult {
	t.Helper()
	cmd := exec.Command(os.Args[0], args...)
	cmd.Env = append(append(os.Environ(), runMainEnv+"=1"), env...)
	if stdin != nil {
		cmd.Stdin = bytes.NewReader(stdin)
	}
	var out, errs bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errs
	err := cmd.Run()
	res := subprocessResult{stdout: out.Bytes(), stderr: errs.Bytes()}
	if cmd.ProcessState == nil {
		t.Fatalf("could not start %s: %v", os.Args[0], err)
	}
	res.code = cmd.ProcessState.ExitCode()
	res.state = cmd.ProcessState.String()
	return res
}
