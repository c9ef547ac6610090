namespace Sibyl.Perturbation.Tests.Loops;

/// <summary>
/// Laurent polynomials in K = k², Q = q², R = p² = |k − q|² (integer exponents of either sign), enough to expand
/// every mode-coupling structure into monomials for the one-loop master integral.
/// </summary>
internal sealed class RationalMonomials
{
    private readonly Dictionary<(int K, int Q, int R), double> _terms = [];

    public IReadOnlyDictionary<(int K, int Q, int R), double> Terms => _terms;

    public static RationalMonomials Term(double coefficient, int k, int q, int r)
    {
        var result = new RationalMonomials();
        result.Add((k, q, r), coefficient);
        return result;
    }

    public static RationalMonomials operator +(RationalMonomials a, RationalMonomials b)
    {
        var result = new RationalMonomials();
        foreach (var (key, value) in a._terms)
        {
            result.Add(key, value);
        }

        foreach (var (key, value) in b._terms)
        {
            result.Add(key, value);
        }

        return result;
    }

    public static RationalMonomials operator -(RationalMonomials a, RationalMonomials b) => a + (b * -1.0);

    public static RationalMonomials operator *(RationalMonomials a, double factor)
    {
        var result = new RationalMonomials();
        foreach (var (key, value) in a._terms)
        {
            result.Add(key, value * factor);
        }

        return result;
    }

    public static RationalMonomials operator *(RationalMonomials a, RationalMonomials b)
    {
        var result = new RationalMonomials();
        foreach (var (ka, va) in a._terms)
        {
            foreach (var (kb, vb) in b._terms)
            {
                result.Add((ka.K + kb.K, ka.Q + kb.Q, ka.R + kb.R), va * vb);
            }
        }

        return result;
    }

    private void Add((int K, int Q, int R) key, double value)
    {
        _terms[key] = _terms.TryGetValue(key, out double existing) ? existing + value : value;
        if (_terms[key] == 0.0)
        {
            _terms.Remove(key);
        }
    }
}
