#include "evaluator/file_text.h"

#include <doctest/doctest.h>
#include <sys/stat.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <thread>

namespace fs = std::filesystem;

TEST_CASE("read_file_text: whole files, pipes, and a clear message for a missing file") {
  const fs::path dir = fs::temp_directory_path() / "tg_file_text";
  fs::remove_all(dir);
  fs::create_directories(dir);
  std::string bytes(200000, 'x');  // more than one read chunk, with NUL and CR bytes in it
  bytes[5] = '\0';
  bytes[70000] = '\r';
  std::ofstream(dir / "a.bin", std::ios::binary) << bytes;
  CHECK(treegate::read_file_text((dir / "a.bin").string()) == bytes);
  std::ofstream(dir / "empty.txt");
  CHECK(treegate::read_file_text((dir / "empty.txt").string()).empty());
  // A named pipe has no size: it is read to its end.
  const std::string fifo = (dir / "pipe").string();
  REQUIRE(::mkfifo(fifo.c_str(), 0600) == 0);
  std::thread writer([&] { std::ofstream(fifo, std::ios::binary) << bytes; });
  CHECK(treegate::read_file_text(fifo) == bytes);
  writer.join();
  CHECK_THROWS_WITH(treegate::read_file_text((dir / "none.yaml").string()),
                    ((dir / "none.yaml").string() + ": cannot open file for reading").c_str());
  CHECK_THROWS_WITH(treegate::read_file_text(dir.string()),
                    (dir.string() + ": is a folder; expected a file").c_str());
  CHECK_THROWS_WITH(treegate::open_input_file(dir.string()),
                    (dir.string() + ": is a folder; expected a file").c_str());
  CHECK(treegate::open_input_file((dir / "a.bin").string()).get() == 'x');
  fs::remove_all(dir);
}
