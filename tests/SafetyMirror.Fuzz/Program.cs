using SafetyMirror.Fuzz;

// Usage: SafetyMirror.Fuzz TARGET            — afl++ feeds inputs (run.sh does this after instrumenting)
//        SafetyMirror.Fuzz TARGET FILE...    — replays files once each, to reproduce a crash with its stack trace
if (args.Length == 0 || !FuzzTargets.ByName.TryGetValue(args[0], out var target))
{
    Console.Error.WriteLine($"Name a target: {string.Join(", ", FuzzTargets.ByName.Keys)}");
    return 2;
}

if (args.Length > 1)
{
    foreach (var file in args.Skip(1))
    {
        target(File.ReadAllBytes(file));
    }

    return 0;
}

SharpFuzz.Fuzzer.OutOfProcess.Run(stream =>
{
    using var buffer = new MemoryStream();
    stream.CopyTo(buffer);
    target(buffer.ToArray());
});
return 0;
