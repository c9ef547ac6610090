using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology.Tests.Parameters;

public class ParameterOutOfRangeExceptionTests
{
    [Fact]
    public void Message_names_the_parameter_once_without_the_framework_suffix()
    {
        // The CLI, the run log and the server print Message as it is; ArgumentException would append
        // " (Parameter 'h')", repeating the name the text already starts with. ParamName still carries it for code.
        var e = new ParameterOutOfRangeException("h", "must lie in (0, 2], got 3");

        Assert.Equal("h: must lie in (0, 2], got 3", e.Message);
        Assert.Equal("h", e.ParamName);
        Assert.Equal("h", e.Name);
    }
}
