// libFuzzer target: the site-file loader and the field records it names. The input is the site
// file (TOML); the demo's CSV files sit beside it, so a valid input reads real records. Bad input
// must end in base::InputError; anything else (a crash, a sanitizer report, another exception)
// is a finding.
#include <cstddef>
#include <cstdint>
#include <filesystem>

#include "fuzz_input_file.hpp"
#include "wetfront/base/input_error.hpp"
#include "wetfront/site/season_setup.hpp"
#include "wetfront/site/site_file.hpp"

extern "C" int LLVMFuzzerInitialize(int*, char***) {
  // The demo's records beside the site file.
  for (const auto& entry : std::filesystem::directory_iterator(WETFRONT_DEMO_DIR)) {
    if (entry.path().extension() == ".csv")
      std::filesystem::copy_file(entry.path(), wetfront::fuzz::scratch_folder() / entry.path().filename(),
                                 std::filesystem::copy_options::overwrite_existing);
  }
  return 0;
}

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const auto path = wetfront::fuzz::input_file("site.toml", data, size);
  try {
    const wetfront::site::SiteSetup site = wetfront::site::load_site_file(path);
    (void)wetfront::site::read_field_records(site);
  } catch (const wetfront::base::InputError&) {
  }
  return 0;
}
