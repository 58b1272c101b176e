using System.Diagnostics;
using ThermVerify.Limits;
using ThermVerify.Ngspice;
using ThermVerify.Tests.Firmware;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// The shared library runs in a worker process that can be abandoned: a library that hangs or crashes on a deck
/// becomes a clear error (exit code 3), Ctrl+C stops it at once, and nothing is left behind. The misbehaving library
/// is a stand-in compiled here with gcc, with ngspice's entry points (sharedspice.h) and the fault asked for.
/// The tests run apart from the others, because they look at the temporary folders this process leaves.
/// </summary>
[Collection(TemporaryFolderCollection.Name)]
public sealed class NgspiceWorkerTests : IDisposable
{
    private const string FakeLibrary = """
        #include <signal.h>
        #include <stdio.h>
        #include <stdlib.h>
        #include <string.h>
        #include <unistd.h>
        static char *none[] = { 0 };
        int ngSpice_Init(void *a, void *b, void *c, void *d, void *e, void *f, void *g) { return 0; }
        int ngSpice_Circ(char **lines) { return 0; }
        int ngSpice_Command(char *command) {
            if (command && strcmp(command, "run") == 0) {
                const char *marker = getenv("FAKE_MARKER");
                if (marker) { FILE *f = fopen(marker, "w"); if (f) fclose(f); }
                const char *mode = getenv("FAKE_MODE");
                if (mode && strcmp(mode, "crash") == 0) *(volatile int *)0 = 1; /* a memory fault, as a broken library makes */
                if (mode && strcmp(mode, "hang") == 0) for (;;) pause();
                printf("garbage the worker must not mistake for an answer\n");
                fflush(stdout);
            }
            return 0;
        }
        void *ngGet_Vec_Info(char *name) { return 0; }
        char *ngSpice_CurPlot(void) { return "const"; }
        char **ngSpice_AllPlots(void) { return none; }
        char **ngSpice_AllVecs(char *plot) { return none; }
        """;

    private const string Deck = "fake\nR1 a 0 1k\nI1 0 a dc 1m\n.op\n.end\n";

    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-fake-ngspice-");

    public void Dispose() => folder.Delete(recursive: true);

    private string Compile()
    {
        var source = Path.Combine(folder.FullName, "fake.c");
        var library = Path.Combine(folder.FullName, "libfake.so");
        File.WriteAllText(source, FakeLibrary);
        using var gcc = Process.Start(GccFactAttribute.GccPath ?? "gcc", ["-shared", "-fPIC", "-o", library, source])!;
        gcc.WaitForExit();
        Assert.Equal(0, gcc.ExitCode);
        return library;
    }

    private static NgspiceEngine Engine(string library, TimeSpan limit) => new(NgspiceMode.SharedLibrary, limit, library);

    internal static IEnumerable<string> WorkerFolders() =>
        Directory.GetDirectories(Path.GetTempPath(), $"thermverify-ngspice-{Environment.ProcessId}-*");

    [GccFact]
    public void A_library_that_crashes_is_reported_with_its_signal_and_thermverify_goes_on()
    {
        if (!OperatingSystem.IsLinux() || !NgspiceLibrary.IsAvailable) return;
        using var engine = Engine(Compile(), TimeSpan.FromMinutes(5));
        using (new EnvironmentScope("FAKE_MODE", "crash"))
        {
            var e = Assert.Throws<NgspiceException>(() => engine.Run(Deck));
            Assert.Contains("crashed", e.Message);
            Assert.Contains("signal 11", e.Message);
        }
    }

    [GccFact]
    public void A_library_that_hangs_is_stopped_at_the_deck_time_limit()
    {
        if (!OperatingSystem.IsLinux() || !NgspiceLibrary.IsAvailable) return;
        using var engine = Engine(Compile(), TimeSpan.FromSeconds(1)); // the engine's own limit, not a timing assertion
        using (new EnvironmentScope("FAKE_MODE", "hang"))
        {
            var e = Assert.Throws<NgspiceException>(() => engine.Run(Deck));
            Assert.Contains("did not finish the deck within 1 s", e.Message);
        }
    }

    [GccFact]
    public void Cancelling_a_hanging_deck_stops_the_worker_and_leaves_no_folder()
    {
        if (!OperatingSystem.IsLinux() || !NgspiceLibrary.IsAvailable) return;
        var marker = Path.Combine(folder.FullName, "running");
        using var engine = Engine(Compile(), TimeSpan.FromMinutes(30));
        using var scope = new EnvironmentScope("FAKE_MODE", "hang");
        using var marking = new EnvironmentScope("FAKE_MARKER", marker);
        using var cancel = new CancellationTokenSource();
        var before = WorkerFolders().ToHashSet(); // engines of other tests may keep idle workers until this process ends
        var run = Task.Run(() =>
        {
            using var work = Work.Scope(cancel.Token);
            engine.Run(Deck);
        });
        // Wait until the library is inside the deck; the generous guard only stops a broken test from hanging CI.
        var guard = Stopwatch.StartNew();
        while (!File.Exists(marker) && guard.Elapsed < TimeSpan.FromMinutes(5)) Thread.Sleep(20);
        Assert.True(File.Exists(marker), "the worker never started the deck");
        cancel.Cancel();
        Assert.ThrowsAny<OperationCanceledException>(() => run.GetAwaiter().GetResult());
        engine.Dispose();
        Assert.Empty(WorkerFolders().Except(before));
    }

    [Fact]
    public void Garbage_and_truncated_raw_files_are_clear_errors()
    {
        string[] damaged =
        [
            "",
            "garbage\n\0\0\0",
            "Title: t\nPlotname: DC transfer characteristic\nFlags: real\nNo. Variables: 2\nNo. Points: 3\nVariables:\n\t0\ttemp-sweep\ttemperature\n\t1\tv(out)\tvoltage\nValues:\n0\t1\n\t2\n",
            "Title: t\nNo. Variables: 99999\nNo. Points: 2147483647\nVariables:\n",
            "Title: t\nNo. Variables: 1\nNo. Points: 1\nVariables:\n\t0\n\nValues:\n0\t1\n",
            "Title: t\nNo. Variables: 1\nNo. Points: 1\nVariables:\n\t0\tx\tvoltage\nValues:\n0\tnot-a-number\n",
            "Title: t\nNo. Variables: -1\nNo. Points: 1\nVariables:\n",
            "Title: t\nFlags: complex\nNo. Variables: 1\nNo. Points: 1\nVariables:\n\t0\tx\tvoltage\nValues:\n0\t1\n",
        ];
        foreach (var text in damaged)
        {
            var e = Assert.Throws<NgspiceException>(() => AsciiRawReader.Read(text));
            Assert.Contains("result file is damaged", e.Message);
        }
    }

    [Fact]
    public void Folders_of_processes_that_were_killed_are_swept()
    {
        // A folder named after a process that no longer exists (pid 0x7ffffffe is never handed out here).
        var abandoned = Directory.CreateDirectory(Path.Combine(Path.GetTempPath(), $"thermverify-ngspice-{int.MaxValue - 1}-test"));
        File.WriteAllText(Path.Combine(abandoned.FullName, "deck.cir"), "left behind");
        TemporaryFolders.SweepAbandoned();
        Assert.False(Directory.Exists(abandoned.FullName));
    }

    /// <summary>Sets an environment variable for the workers started inside it (they inherit this process's environment).</summary>
    private sealed class EnvironmentScope : IDisposable
    {
        private static readonly Lock Gate = new();
        private readonly string name;

        public EnvironmentScope(string name, string value)
        {
            Gate.Enter();
            this.name = name;
            Environment.SetEnvironmentVariable(name, value);
        }

        public void Dispose()
        {
            Environment.SetEnvironmentVariable(name, null);
            Gate.Exit();
        }
    }
}

/// <summary>Tests that look at the temporary folders of this process run alone, after the parallel ones.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class TemporaryFolderCollection
{
    public const string Name = "temporary folders";
}
