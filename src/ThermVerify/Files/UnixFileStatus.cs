using System.Buffers.Binary;
using System.Runtime.InteropServices;
using Microsoft.Win32.SafeHandles;

namespace ThermVerify.Files;

/// <summary>What kind of object a path or an open file is, as the kernel says (statx(2)).</summary>
internal enum FileKind { Regular, Directory, SymbolicLink, CharacterDevice, BlockDevice, Fifo, Socket, Unknown }

/// <summary>The few facts of statx(2) the input and output checks need.</summary>
internal readonly record struct FileStatus(FileKind Kind, long SizeBytes, uint LinkCount, ulong Device, ulong Inode);

/// <summary>
/// Linux system calls .NET does not expose: open(2) with O_NOFOLLOW and O_NONBLOCK (so neither a link nor a FIFO can
/// stand in for a file, and opening a FIFO never blocks) and statx(2) for the file type and link count of a path or
/// of an open file. statx's record has the same layout on every Linux architecture, unlike struct stat.
/// </summary>
internal static class UnixFileStatus
{
    private const int OpenReadOnly = 0;
    private const int OpenNonBlocking = 0x800;      // O_NONBLOCK
    private const int OpenNoFollow = 0x20000;       // O_NOFOLLOW (x86-64 and generic; ARM64 uses 0x8000)
    private const int OpenNoFollowArm = 0x8000;
    private const int OpenCloseOnExec = 0x80000;    // O_CLOEXEC
    private const int OpenNoControllingTerminal = 0x100; // O_NOCTTY
    private const int AtCurrentDirectory = -100;    // AT_FDCWD
    private const int AtEmptyPath = 0x1000;
    private const int AtNoFollow = 0x100;           // AT_SYMLINK_NOFOLLOW
    private const uint BasicStatistics = 0x7ff;     // STATX_BASIC_STATS
    private const int RecordBytes = 256;

    public static bool Supported => OperatingSystem.IsLinux();

    /// <summary>The status of <paramref name="path"/> itself (a link is reported as a link); null when it does not exist.</summary>
    public static FileStatus? OfPath(string path)
    {
        var record = new byte[RecordBytes];
        if (Statx(AtCurrentDirectory, path, AtNoFollow, BasicStatistics, record) != 0)
        {
            var errno = Marshal.GetLastPInvokeError();
            if (errno is 2 or 20) return null; // ENOENT, ENOTDIR
            throw new IOException($"cannot examine {path} (errno {errno})");
        }
        return Read(record);
    }

    /// <summary>The status of an open file.</summary>
    public static FileStatus OfHandle(SafeFileHandle handle)
    {
        var record = new byte[RecordBytes];
        var fd = (int)handle.DangerousGetHandle();
        if (Statx(fd, "", AtEmptyPath, BasicStatistics, record) != 0)
            throw new IOException($"cannot examine an open file (errno {Marshal.GetLastPInvokeError()})");
        return Read(record);
    }

    /// <summary>Opens for reading without following a link in the last component and without blocking on a FIFO.</summary>
    public static SafeFileHandle OpenForReading(string path)
    {
        var noFollow = RuntimeInformation.ProcessArchitecture is Architecture.Arm64 or Architecture.Arm ? OpenNoFollowArm : OpenNoFollow;
        var fd = Open(path, OpenReadOnly | OpenNonBlocking | noFollow | OpenCloseOnExec | OpenNoControllingTerminal, 0);
        if (fd < 0)
        {
            var errno = Marshal.GetLastPInvokeError();
            throw errno switch
            {
                40 => new InputFileException("is a link", "Name the file itself, not a link to it."), // ELOOP from O_NOFOLLOW
                2 => new InputFileException("was not found", "Check the name."),
                13 => new InputFileException("cannot be read (permission denied)", "Check the file's permissions."),
                _ => new InputFileException($"cannot be opened (errno {errno})", "Check the path."),
            };
        }
        return new SafeFileHandle(fd, ownsHandle: true);
    }

    /// <summary>The path the kernel holds for an open file (Linux /proc), to confirm what was opened is where it was resolved.</summary>
    public static string? PathOf(SafeFileHandle handle) =>
        new FileInfo($"/proc/self/fd/{(int)handle.DangerousGetHandle()}").LinkTarget;

    private static FileStatus Read(byte[] record)
    {
        var links = BinaryPrimitives.ReadUInt32LittleEndian(record.AsSpan(16));
        var mode = BinaryPrimitives.ReadUInt16LittleEndian(record.AsSpan(28));
        var inode = BinaryPrimitives.ReadUInt64LittleEndian(record.AsSpan(32));
        var size = BinaryPrimitives.ReadUInt64LittleEndian(record.AsSpan(40));
        var deviceMajor = BinaryPrimitives.ReadUInt32LittleEndian(record.AsSpan(136));
        var deviceMinor = BinaryPrimitives.ReadUInt32LittleEndian(record.AsSpan(140));
        var kind = (mode & 0xF000) switch
        {
            0x8000 => FileKind.Regular,
            0x4000 => FileKind.Directory,
            0xA000 => FileKind.SymbolicLink,
            0x2000 => FileKind.CharacterDevice,
            0x6000 => FileKind.BlockDevice,
            0x1000 => FileKind.Fifo,
            0xC000 => FileKind.Socket,
            _ => FileKind.Unknown,
        };
        return new FileStatus(kind, (long)Math.Min(size, long.MaxValue), links, ((ulong)deviceMajor << 32) | deviceMinor, inode);
    }

    [DllImport("libc", EntryPoint = "statx", SetLastError = true)]
    private static extern int Statx(int directory, [MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags, uint mask, byte[] record);

    [DllImport("libc", EntryPoint = "open", SetLastError = true)]
    private static extern int Open([MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags, int mode);
}
