#include "core/io/atomic_file.hpp"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <sstream>
#include <string>

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include "core/error.hpp"

namespace terzo {

namespace {

std::string errno_text() { return std::strerror(errno); }

// Writes all of data to fd, retrying short writes.
bool write_all(int fd, const std::string& data) {
    std::size_t done = 0;
    while (done < data.size()) {
        ssize_t n = ::write(fd, data.data() + done, data.size() - done);
        if (n < 0) {
            if (errno == EINTR) continue;
            return false;
        }
        done += static_cast<std::size_t>(n);
    }
    return true;
}

} // namespace

void write_file_atomically(const std::filesystem::path& path,
                           const std::function<void(std::ostream&)>& write, Overwrite overwrite) {
    const SourcePos pos{path.string(), 0, 0};
    std::error_code ec;
    if (std::filesystem::is_directory(path, ec)) fail(pos, "is a folder; give a file name");
    if (overwrite == Overwrite::refuse && std::filesystem::exists(path, ec))
        fail(pos, "already exists and was not changed (allow overwriting to replace it)");

    std::ostringstream buffer;
    write(buffer); // may throw; nothing is on disk yet
    const std::string data = buffer.str();

    std::filesystem::path dir = path.parent_path();
    if (dir.empty()) dir = ".";
    std::string tmpl = (dir / ("." + path.filename().string() + ".tmp-XXXXXX")).string();
    int fd = ::mkstemp(tmpl.data());
    if (fd < 0) fail(pos, "cannot create a file in " + dir.string() + ": " + errno_text());
    auto give_up = [&](const std::string& what) {
        std::string reason = errno_text();
        ::close(fd);
        ::unlink(tmpl.c_str());
        fail(pos, what + ": " + reason + "; the target was not changed");
    };
    if (!write_all(fd, data)) give_up("cannot write");
    if (::fsync(fd) != 0) give_up("cannot flush to disk");
    // mkstemp makes the file 0600; give it the usual permissions for a user's document.
    ::fchmod(fd, 0644);
    if (::close(fd) != 0) {
        std::string reason = errno_text();
        ::unlink(tmpl.c_str());
        fail(pos, "cannot close: " + reason + "; the target was not changed");
    }
    if (overwrite == Overwrite::refuse) {
        // link() fails if the target appeared meanwhile, so a concurrent file is never lost.
        if (::link(tmpl.c_str(), path.c_str()) != 0) {
            std::string reason = errno_text();
            ::unlink(tmpl.c_str());
            fail(pos, "cannot create: " + reason);
        }
        ::unlink(tmpl.c_str());
    } else if (std::rename(tmpl.c_str(), path.c_str()) != 0) {
        std::string reason = errno_text();
        ::unlink(tmpl.c_str());
        fail(pos, "cannot replace: " + reason + "; the target was not changed");
    }
    // Make the rename itself durable.
    int dfd = ::open(dir.c_str(), O_RDONLY | O_DIRECTORY);
    if (dfd >= 0) {
        ::fsync(dfd);
        ::close(dfd);
    }
}

} // namespace terzo
