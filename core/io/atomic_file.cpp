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

// The system's reason, with what it means for a user where the words alone are unclear.
std::string errno_text() {
    const int e = errno;
    std::string text = std::strerror(e);
    if (e == ENOSPC || e == EDQUOT || e == EFBIG)
        return "the disk is full or a file size limit was reached (" + text + ")";
    return text;
}

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

void check_target(const std::filesystem::path& path, Overwrite overwrite) {
    namespace fs = std::filesystem;
    const SourcePos pos{path.string(), 0, 0};
    std::error_code ec;
    const fs::file_status st = fs::status(path, ec);
    if (fs::is_directory(st)) fail(pos, "is a folder; give a file name");
    // Renaming over a device or a pipe would replace it with a plain file.
    if (fs::exists(st) && !fs::is_regular_file(st))
        fail(pos, "is not a regular file (a device, pipe or socket); give a file name");
    if (overwrite == Overwrite::refuse && fs::exists(st))
        fail(pos, "already exists and was not changed (allow overwriting to replace it)");
    // The folder is checked by its absolute name but named as the user wrote it.
    const fs::file_status dir_st =
        fs::status(fs::absolute(path, ec).lexically_normal().parent_path(), ec);
    const std::string dir = path.has_parent_path() ? path.parent_path().string() : ".";
    if (!fs::exists(dir_st)) fail(pos, "folder " + dir + " does not exist");
    if (!fs::is_directory(dir_st)) fail(pos, dir + " is a file, not a folder");
}

void write_file_atomically(const std::filesystem::path& path,
                           const std::function<void(std::ostream&)>& write, Overwrite overwrite) {
    const SourcePos pos{path.string(), 0, 0};
    check_target(path, overwrite);
    std::error_code ec;
    const std::string unchanged = std::filesystem::exists(path, ec)
                                      ? "; the existing file was not changed"
                                      : "; no file was created";

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
        fail(pos, what + ": " + reason + unchanged);
    };
    if (!write_all(fd, data)) give_up("cannot write");
    if (::fsync(fd) != 0) give_up("cannot flush to disk");
    // mkstemp makes the file 0600; give it the usual permissions for a user's document.
    ::fchmod(fd, 0644);
    if (::close(fd) != 0) {
        std::string reason = errno_text();
        ::unlink(tmpl.c_str());
        fail(pos, "cannot close: " + reason + unchanged);
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
        fail(pos, "cannot replace: " + reason + unchanged);
    }
    // Make the rename itself durable.
    int dfd = ::open(dir.c_str(), O_RDONLY | O_DIRECTORY);
    if (dfd >= 0) {
        ::fsync(dfd);
        ::close(dfd);
    }
}

} // namespace terzo
