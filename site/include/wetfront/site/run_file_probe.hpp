// A first read of a run file in a child process, so that a damaged file cannot crash the reader.
#pragma once

#include <string>

namespace wetfront::site {

// Debian's libhdf5 1.10 crashes or loops on some damaged files (a corrupt global heap of
// variable-length strings; found by fuzz/fuzz_run_file). The file is read once in a child
// process with no output; a child that is killed, aborts, runs out of memory or takes longer
// than `seconds` makes this throw base::InputError naming the file as damaged. A file the child
// reads, or refuses with RunFileError, is left to the real read. Where fork fails, nothing is
// checked.
void probe_run_file(const std::string& path, int seconds = 60);

}  // namespace wetfront::site
