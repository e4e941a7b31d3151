#!/usr/bin/python3
"""Execute plumbline's demo notebooks in a real Jupyter kernel and check their outputs.

Why not `jupyter nbconvert --execute`: the Deno kernel reports the "idle" status a few
milliseconds before its last output messages, and nbconvert stops listening at "idle", so
outputs go missing or are filed under the next cell. This runner keeps reading the iopub
channel until it has been silent for a grace period after "idle", files every message by
its parent msg_id, and treats any output that arrives later still as a failure.

Modes:
  --check   execute every notebook, then compare its outputs with the committed ones
            (exact text of every output's data, per MIME type; execution counts and
            output metadata are ignored)
  --write   execute every notebook and save the fresh outputs into the notebook file

In both modes the run fails on any error output, on an execute_reply with status
"error", on a cell or notebook timeout, and on any output that carries a Vega-Lite spec
without a static picture of the chart (`image/png`, or a PNG `<img>` or an `<svg>` in
`text/html`).

Usage:
  /usr/bin/python3 tools/notebooks/run_notebooks.py --check [NOTEBOOK_OR_DIR ...]
  /usr/bin/python3 tools/notebooks/run_notebooks.py --write tests/fixtures/notebooks/smoke.ipynb

Without paths it runs notebooks/*.ipynb under the repository root.
"""

import argparse
import json
import os
import queue
import shutil
import sys
import time
from pathlib import Path

import nbformat
from jupyter_client import KernelManager
from jupyter_client.kernelspec import KernelSpecManager, NoSuchKernel

VEGALITE_MIME = "application/vnd.vegalite.v5+json"
DEFAULT_KERNEL = "deno"
REPO_ROOT = Path(__file__).resolve().parents[2]


class NotebookFailure(Exception):
    """A notebook failed to execute, or its outputs differ from the committed ones."""


def _parse_args(argv):
    parser = argparse.ArgumentParser(
        description="Execute notebooks with a Jupyter kernel; check or write their outputs"
    )
    mode = parser.add_mutually_exclusive_group(required=True)
    mode.add_argument(
        "--check", action="store_true", help="compare fresh outputs with the committed ones"
    )
    mode.add_argument(
        "--write", action="store_true", help="save fresh outputs into the notebook files"
    )
    parser.add_argument("paths", nargs="*", help="notebook files or folders of notebooks")
    parser.add_argument(
        "--kernel",
        default=None,
        help="kernel name (default: the notebook's kernelspec name, else 'deno')",
    )
    parser.add_argument(
        "--grace",
        type=float,
        default=0.3,
        help="seconds of iopub silence to wait for after 'idle' (default 0.3)",
    )
    parser.add_argument(
        "--cell-timeout", type=float, default=120.0, help="seconds per cell (default 120)"
    )
    parser.add_argument(
        "--notebook-timeout",
        type=float,
        default=600.0,
        help="seconds per notebook, kernel start included (default 600)",
    )
    parser.add_argument(
        "--startup-timeout",
        type=float,
        default=60.0,
        help="seconds to wait for the kernel to answer (default 60)",
    )
    return parser.parse_args(argv)


def _collect_notebooks(paths):
    if not paths:
        paths = [str(REPO_ROOT / "notebooks")]
    found = []
    # `deno task notebooks` runs from the repository root; INIT_CWD is where it was typed.
    base = Path(os.environ.get("INIT_CWD", os.getcwd()))
    for raw in paths:
        path = base / raw
        if path.is_dir():
            found.extend(
                p for p in sorted(path.glob("*.ipynb")) if ".ipynb_checkpoints" not in p.parts
            )
        elif path.is_file():
            found.append(path)
        else:
            raise NotebookFailure(f"No notebook at {raw}: pass an .ipynb file or a folder")
    if not found:
        raise NotebookFailure(f"No notebooks found in {', '.join(paths)}: add an .ipynb file")
    return [p.resolve() for p in found]


def _check_kernel(name):
    """Fail early, with a useful message, when the kernel is missing or points nowhere."""
    try:
        spec = KernelSpecManager().get_kernel_spec(name)
    except NoSuchKernel:
        raise NotebookFailure(
            f"No Jupyter kernel named '{name}': register it with `deno run --allow-run "
            "--allow-read --allow-write --allow-env tools/notebooks/install_kernel.ts`"
        ) from None
    exe = spec.argv[0] if spec.argv else ""
    if not (os.path.isabs(exe) and os.access(exe, os.X_OK)) and shutil.which(exe) is None:
        raise NotebookFailure(
            f"Kernel '{name}' starts a program that does not exist: {exe}: "
            "register it again with tools/notebooks/install_kernel.ts"
        )
    return spec


def _output_from_msg(msg):
    msg_type = msg["msg_type"]
    content = msg["content"]
    if msg_type == "stream":
        return nbformat.v4.new_output("stream", name=content["name"], text=content["text"])
    if msg_type == "display_data":
        return nbformat.v4.new_output(
            "display_data", data=content["data"], metadata=content.get("metadata", {})
        )
    if msg_type == "execute_result":
        return nbformat.v4.new_output(
            "execute_result",
            data=content["data"],
            metadata=content.get("metadata", {}),
            execution_count=content.get("execution_count"),
        )
    if msg_type == "error":
        return nbformat.v4.new_output(
            "error",
            ename=content.get("ename", ""),
            evalue=content.get("evalue", ""),
            traceback=content.get("traceback", []),
        )
    return None


class _CellOutputs:
    """Builds a cell's output list from iopub messages, the way a notebook front end does."""

    def __init__(self):
        self.outputs = []
        self._clear_pending = False
        self._display_ids = {}

    def add(self, msg):
        msg_type = msg["msg_type"]
        content = msg["content"]
        if msg_type == "clear_output":
            if content.get("wait"):
                self._clear_pending = True
            else:
                self.outputs = []
                self._display_ids = {}
            return
        if msg_type == "update_display_data":
            display_id = content.get("transient", {}).get("display_id")
            for index in self._display_ids.get(display_id, []):
                self.outputs[index]["data"] = content["data"]
                self.outputs[index]["metadata"] = content.get("metadata", {})
            return
        output = _output_from_msg(msg)
        if output is None:
            return
        if self._clear_pending:
            self.outputs = []
            self._display_ids = {}
            self._clear_pending = False
        display_id = content.get("transient", {}).get("display_id")
        if display_id is not None:
            self._display_ids.setdefault(display_id, []).append(len(self.outputs))
        last = self.outputs[-1] if self.outputs else None
        if (
            output["output_type"] == "stream"
            and last is not None
            and last["output_type"] == "stream"
            and last["name"] == output["name"]
        ):
            last["text"] += output["text"]
        else:
            self.outputs.append(output)


class _KernelSession:
    """One running kernel whose working directory is the notebook's folder."""

    def __init__(self, kernel_name, cwd, startup_timeout):
        self.km = KernelManager(kernel_name=kernel_name)
        # NO_COLOR keeps ANSI colour codes out of text/plain results, so outputs compare.
        env = dict(os.environ, NO_COLOR="1")
        self.km.start_kernel(cwd=str(cwd), env=env)
        self.kc = self.km.client()
        self.kc.start_channels()
        try:
            self.kc.wait_for_ready(timeout=startup_timeout)
        except RuntimeError as err:
            self.close()
            raise NotebookFailure(
                f"Kernel '{kernel_name}' did not answer in {startup_timeout:.0f} s: {err}"
            ) from None
        self.info = self._kernel_info()
        # Messages whose cell has already been finished: any later one is a failure.
        self.finished = {}

    def _kernel_info(self):
        msg_id = self.kc.kernel_info()
        deadline = time.monotonic() + 10
        while time.monotonic() < deadline:
            try:
                reply = self.kc.get_shell_msg(timeout=1)
            except queue.Empty:
                continue
            if reply["parent_header"].get("msg_id") == msg_id:
                return reply["content"]
        return {}

    def run_cell(self, label, index, source, timeout, grace):
        """Execute one cell; return its outputs and the execute_reply content."""
        msg_id = self.kc.execute(source, store_history=True, allow_stdin=False, stop_on_error=True)
        collected = _CellOutputs()
        deadline = time.monotonic() + timeout
        idle = False
        while True:
            remaining = deadline - time.monotonic()
            if remaining <= 0:
                raise NotebookFailure(
                    f"{label}: cell {index} timed out after {timeout:.0f} s: make it faster or raise "
                    "--cell-timeout"
                )
            wait = min(grace, remaining) if idle else min(1.0, remaining)
            try:
                msg = self.kc.get_iopub_msg(timeout=wait)
            except queue.Empty:
                if idle:
                    break  # silent for the whole grace period after idle
                continue
            parent = msg["parent_header"].get("msg_id")
            if parent != msg_id:
                if parent in self.finished and msg["msg_type"] not in ("status",):
                    raise NotebookFailure(
                        f"{label}: cell {self.finished[parent]} sent a '{msg['msg_type']}' message "
                        f"after its grace period, while cell {index} ran: raise --grace"
                    )
                continue
            if msg["msg_type"] == "status":
                if msg["content"]["execution_state"] == "idle":
                    idle = True
                continue
            collected.add(msg)
        self.finished[msg_id] = index
        reply = self._execute_reply(label, msg_id, index, deadline)
        return collected.outputs, reply

    def _execute_reply(self, label, msg_id, index, deadline):
        while True:
            remaining = deadline - time.monotonic()
            if remaining <= 0:
                raise NotebookFailure(f"{label}: cell {index} sent no execute_reply: the kernel hung")
            try:
                reply = self.kc.get_shell_msg(timeout=min(1.0, remaining))
            except queue.Empty:
                continue
            if reply["parent_header"].get("msg_id") == msg_id:
                return reply["content"]

    def close(self):
        try:
            self.kc.stop_channels()
        except Exception:  # noqa: BLE001 - best effort during cleanup
            pass
        try:
            self.km.shutdown_kernel(now=False)
        except Exception:  # noqa: BLE001
            try:
                self.km.shutdown_kernel(now=True)
            except Exception:  # noqa: BLE001
                pass


def _error_text(output):
    lines = [f"{output.get('ename', '')}: {output.get('evalue', '')}"]
    lines.extend(output.get("traceback", []))
    return "\n".join(lines)


def _check_vegalite_fallback(path, index, outputs):
    for out_index, output in enumerate(outputs):
        data = output.get("data", {})
        if VEGALITE_MIME in data:
            html = _mime_text(data.get("text/html", ""))
            picture = (
                "image/png" in data
                or '<img src="data:image/png;base64,' in html
                or "<svg" in html
            )
            if not picture:
                raise NotebookFailure(
                    f"{path.name}: cell {index}, output {out_index} carries {VEGALITE_MIME} "
                    "without a static picture of the chart (image/png, or a PNG <img> or an "
                    "<svg> in text/html): add one so the chart reads where no Vega-Lite runs"
                )


def execute_notebook(path, kernel_name, cell_timeout, notebook_timeout, grace, startup_timeout):
    """Execute every code cell; return (notebook, fresh outputs per code cell index)."""
    nb = nbformat.read(str(path), as_version=4)
    name = kernel_name or nb.metadata.get("kernelspec", {}).get("name") or DEFAULT_KERNEL
    _check_kernel(name)
    started = time.monotonic()
    session = _KernelSession(name, path.parent, min(startup_timeout, notebook_timeout))
    fresh = {}
    try:
        for index, cell in enumerate(nb.cells):
            if cell.cell_type != "code":
                continue
            remaining = notebook_timeout - (time.monotonic() - started)
            if remaining <= 0:
                raise NotebookFailure(
                    f"{path.name} timed out after {notebook_timeout:.0f} s at cell {index}: "
                    "make it faster or raise --notebook-timeout"
                )
            outputs, reply = session.run_cell(
                path.name, index, cell.source, min(cell_timeout, remaining), grace
            )
            for output in outputs:
                if output["output_type"] == "error":
                    raise NotebookFailure(
                        f"{path.name}: cell {index} produced an error output:\n"
                        f"{_error_text(output)}"
                    )
            if reply.get("status") != "ok":
                raise NotebookFailure(
                    f"{path.name}: cell {index} failed ({reply.get('status')}):\n"
                    f"{_error_text(reply)}"
                )
            _check_vegalite_fallback(path, index, outputs)
            fresh[index] = (outputs, reply.get("execution_count"))
    finally:
        session.close()
    language_info = session.info.get("language_info")
    return nb, fresh, language_info


def _mime_text(value):
    if isinstance(value, list):
        return "".join(value)
    if isinstance(value, str):
        return value
    return json.dumps(value, sort_keys=True, indent=1, ensure_ascii=False)


def _normalized(output):
    """The parts of an output that must match exactly: type, stream text, data per MIME."""
    kind = output["output_type"]
    if kind == "stream":
        return kind, {"stream:" + output["name"]: _mime_text(output["text"])}
    if kind in ("display_data", "execute_result"):
        return kind, {mime: _mime_text(v) for mime, v in sorted(output.get("data", {}).items())}
    if kind == "error":
        return kind, {"error": _error_text(output)}
    return kind, {}


def _first_difference(a, b):
    for pos, (x, y) in enumerate(zip(a, b)):
        if x != y:
            return pos
    return min(len(a), len(b))


def _snippet(text, pos):
    start = max(0, pos - 40)
    return repr(text[start : pos + 40])


def compare_outputs(path, nb, fresh):
    """Raise NotebookFailure describing the first difference from the committed outputs."""
    for index, cell in enumerate(nb.cells):
        if cell.cell_type != "code":
            continue
        committed = cell.get("outputs", [])
        outputs, _ = fresh[index]
        if len(committed) != len(outputs):
            raise NotebookFailure(
                f"{path.name}: cell {index} has {len(outputs)} outputs, the committed notebook "
                f"has {len(committed)}: run --write and review the diff"
            )
        for out_index, (old, new) in enumerate(zip(committed, outputs)):
            old_kind, old_data = _normalized(old)
            new_kind, new_data = _normalized(new)
            if old_kind != new_kind:
                raise NotebookFailure(
                    f"{path.name}: cell {index}, output {out_index} is {new_kind}, the "
                    f"committed one is {old_kind}: run --write and review the diff"
                )
            if sorted(old_data) != sorted(new_data):
                raise NotebookFailure(
                    f"{path.name}: cell {index}, output {out_index} carries MIME types "
                    f"{sorted(new_data)}, the committed one {sorted(old_data)}: run --write "
                    "and review the diff"
                )
            for mime in sorted(old_data):
                if old_data[mime] != new_data[mime]:
                    pos = _first_difference(old_data[mime], new_data[mime])
                    raise NotebookFailure(
                        f"{path.name}: cell {index}, output {out_index}, {mime} differs at "
                        f"character {pos}:\n  committed: {_snippet(old_data[mime], pos)}\n"
                        f"  fresh:     {_snippet(new_data[mime], pos)}\n"
                        "Run --write and review the diff"
                    )


def write_outputs(path, nb, fresh, language_info):
    for index, cell in enumerate(nb.cells):
        if cell.cell_type != "code":
            continue
        outputs, count = fresh[index]
        cell.outputs = outputs
        cell.execution_count = count
        cell.metadata.pop("execution", None)
    if language_info:
        nb.metadata["language_info"] = language_info
    nbformat.validate(nb)
    nbformat.write(nb, str(path))


def main(argv=None):
    args = _parse_args(sys.argv[1:] if argv is None else argv)
    try:
        notebooks = _collect_notebooks(args.paths)
    except NotebookFailure as err:
        print(f"FAIL: {err}", file=sys.stderr)
        return 1
    failures = 0
    for path in notebooks:
        started = time.monotonic()
        try:
            nb, fresh, language_info = execute_notebook(
                path,
                args.kernel,
                args.cell_timeout,
                args.notebook_timeout,
                args.grace,
                args.startup_timeout,
            )
            if args.check:
                for index, cell in enumerate(nb.cells):
                    if cell.cell_type == "code":
                        _check_vegalite_fallback(path, index, cell.get("outputs", []))
                compare_outputs(path, nb, fresh)
                verb = "matches its committed outputs"
            else:
                write_outputs(path, nb, fresh, language_info)
                verb = "written"
        except NotebookFailure as err:
            failures += 1
            print(f"FAIL: {err}", file=sys.stderr)
            continue
        cells = len(fresh)
        print(f"ok: {path.name}: {cells} code cells, {verb} ({time.monotonic() - started:.1f} s)")
    if failures:
        print(f"FAIL: {failures} of {len(notebooks)} notebooks failed", file=sys.stderr)
        return 1
    return 0


if __name__ == "__main__":
    sys.exit(main())
