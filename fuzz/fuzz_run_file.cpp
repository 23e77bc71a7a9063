// libFuzzer target: the run-file reader (`wetfront show`) on arbitrary bytes. Bad input must end
// in profiles::RunFileError; anything else is a finding. The seeds are run files written by
// `wetfront run`; faults inside the HDF5 library itself (Debian's libhdf5, not built with the
// sanitizers) show up as plain crashes.
#include <cstddef>
#include <cstdint>

#include "fuzz_input_file.hpp"
#include "wetfront/profiles/file_save.hpp"
#include "wetfront/profiles/run_file.hpp"

extern "C" int LLVMFuzzerInitialize(int*, char***) {
  wetfront::profiles::silence_hdf5_error_printing();
  return 0;
}

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const auto path = wetfront::fuzz::input_file("input.h5", data, size);
  try {
    (void)wetfront::profiles::read_run(path);
  } catch (const wetfront::profiles::RunFileError&) {
  }
  return 0;
}
