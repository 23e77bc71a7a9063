// Writes the synthetic run record to the path given, for the h5py and plotting tests.
#include <exception>
#include <iostream>

#include "sample_record.hpp"
#include "wetfront/profiles/run_file.hpp"

int main(int argc, char** argv) {
  if (argc != 2) {
    std::cerr << "usage: write_sample_run OUTPUT.h5\n";
    return 2;
  }
  try {
    wetfront::profiles::write_run(argv[1], wetfront::profiles::testing::sample_record());
  } catch (const std::exception& error) {
    std::cerr << error.what() << '\n';
    return 1;
  }
  return 0;
}
