using System.Runtime.InteropServices;

namespace ThermVerify.Ngspice;

/// <summary>
/// ngspice's start-up files (.spiceinit) can run any command, a shell among them, so ngspice never reads one for
/// thermverify. The batch program is started with -n. The shared library reads the file in its working directory,
/// then the one in the account's home folder as the password database names it (not $HOME); the worker runs in an
/// empty private folder, so the first is never there, and libraries that offer ngSpice_nospiceinit are told to skip
/// both. An older library (ngspice 39 has no such switch) would read the home one, so the engine refuses to start
/// while that file exists and says so.
/// </summary>
internal static class StartupFiles
{
    private const string FileName = ".spiceinit";
    private static bool switchedOff;

    /// <summary>Null when the library will read no start-up file; else why the engine cannot start.</summary>
    public static string? Refusal()
    {
        if (switchedOff || SwitchOff()) return null;
        if (File.Exists(FileName))
            return $"the ngspice library would read the start-up file {Path.GetFullPath(FileName)}, which can run commands; it is not thermverify's";
        var home = AccountHome();
        if (home is not null && File.Exists(Path.Combine(home, FileName)))
            return $"the ngspice library would read your start-up file {Path.Combine(home, FileName)} (this version cannot be told not to), " +
                   "and a start-up file can run commands; use --ngspice-process (the program is told to skip it), or rename the file";
        return null;
    }

    /// <summary>True when the library has the switch and it was used.</summary>
    private static bool SwitchOff()
    {
        if (!NgspiceLibrary.IsAvailable || !NgspiceLibrary.TryGetExport("ngSpice_nospiceinit", out var entry)) return false;
        Marshal.GetDelegateForFunctionPointer<NoArguments>(entry)();
        switchedOff = true;
        return true;
    }

    /// <summary>The home folder the password database gives this account (where the library looks), or null.</summary>
    internal static string? AccountHome()
    {
        if (!OperatingSystem.IsLinux()) return Environment.GetFolderPath(Environment.SpecialFolder.UserProfile);
        var entry = GetPasswordEntry(GetUserId());
        if (entry == IntPtr.Zero) return null;
        // struct passwd { char *pw_name; char *pw_passwd; uid_t pw_uid; gid_t pw_gid; char *pw_gecos; char *pw_dir; ... }
        var directory = Marshal.ReadIntPtr(entry, 2 * IntPtr.Size + 8 + IntPtr.Size);
        return Marshal.PtrToStringUTF8(directory);
    }

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    private delegate int NoArguments();

    [DllImport("libc", EntryPoint = "getuid")]
    private static extern uint GetUserId();

    [DllImport("libc", EntryPoint = "getpwuid")]
    private static extern IntPtr GetPasswordEntry(uint userId);
}
