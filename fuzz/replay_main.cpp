// Runs a fuzz target's entry point over files and folders of inputs, without libFuzzer,
// so that every saved crasher stays a regression test in the ordinary build.
#include <filesystem>
#include <fstream>
#include <iostream>
#include <iterator>
#include <vector>

#include "fuzz_target.hpp"

int main(int argc, char** argv) {
    namespace fs = std::filesystem;
    std::size_t count = 0;
    auto replay = [&](const fs::path& p) {
        std::ifstream in(p, std::ios::binary);
        std::vector<char> bytes((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
        LLVMFuzzerTestOneInput(reinterpret_cast<const std::uint8_t*>(bytes.data()), bytes.size());
        ++count;
    };
    for (int i = 1; i < argc; ++i) {
        fs::path arg = argv[i];
        if (fs::is_directory(arg)) {
            for (const auto& e : fs::recursive_directory_iterator(arg))
                if (e.is_regular_file()) replay(e.path());
        } else {
            replay(arg);
        }
    }
    if (count == 0) {
        std::cerr << "replay: no inputs found\n";
        return 1;
    }
    std::cout << "replayed " << count << " inputs without a crash\n";
    return 0;
}
