using SafetyMirror.Fuzz;

namespace SafetyMirror.Api.Tests.Fuzzing;

// Every input with which the coverage-guided fuzzer (tests/SafetyMirror.Fuzz/run.sh) ever made an exception escape a
// reader is kept under tests/SafetyMirror.Fuzz/crashes/TARGET/ and replayed here through the fuzzer's own target:
// the readers must answer each with problems, never an exception.
public sealed class FuzzCrashesTests
{
    public static TheoryData<string, string> Crashes()
    {
        var crashes = new TheoryData<string, string>();
        foreach (var target in FuzzTargets.ByName.Keys)
        {
            var folder = RepositoryFiles.PathOf("tests", "SafetyMirror.Fuzz", "crashes", target);
            foreach (var file in Directory.Exists(folder) ? Directory.GetFiles(folder).Order(StringComparer.Ordinal).ToArray() : [])
            {
                crashes.Add(target, Path.GetFileName(file));
            }
        }

        return crashes;
    }

    [Fact]
    public void Crashes_AreKept()
    {
        Assert.NotEmpty(Crashes());
    }

    [Theory]
    [MemberData(nameof(Crashes))]
    public void Target_CrashInputFound_ReadsWithoutException(string target, string file)
    {
        var input = File.ReadAllBytes(RepositoryFiles.PathOf("tests", "SafetyMirror.Fuzz", "crashes", target, file));

        var escaped = Record.Exception(() => FuzzTargets.ByName[target](input));

        Assert.Null(escaped);
    }
}
